namespace Lookup.Catalogue;

/// <summary>One photo to embed: where it is, what it is filed under, what it may replace.</summary>
internal sealed record PhotoJob(MappedEntry Current, string? Sha256, int? ReplacesNode);

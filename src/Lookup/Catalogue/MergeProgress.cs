namespace Lookup.Catalogue;

/// <summary>Where a merge is: <paramref name="Stage"/> is "reading", "building" or "writing"; counts are parts
/// while reading, vectors while building and photo records while writing.</summary>
internal sealed record MergeProgress(string Stage, int Done, int Total);

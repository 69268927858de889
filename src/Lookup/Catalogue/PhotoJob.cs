namespace Lookup.Catalogue;

/// <summary>One photo to embed: where it is, what it is filed under, what it may replace.</summary>
/// <param name="Current">The scanned photo.</param>
/// <param name="Sha256">Its SHA-256 when already known.</param>
/// <param name="ReplacesNode">The graph node of the version it replaces.</param>
/// <param name="EvidenceOnly">An unchanged indexed photo whose record lacks pixel evidence added since it was indexed
/// (detail and colour thumbnails): decode and refresh the record, keep the embedding and node.</param>
internal sealed record PhotoJob(MappedEntry Current, string? Sha256, int? ReplacesNode, bool EvidenceOnly = false);

namespace Lookup.Store;

/// <summary>A photo of a stored finding: its path (relative to the catalogue root), SKU and SHA-256 at the time.</summary>
public sealed record StoredMember(string Path, string Sku, string Sha256);

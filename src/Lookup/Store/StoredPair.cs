namespace Lookup.Store;

/// <summary>A pair of a stored finding: its key, the two paths, the distance and the relation in words.</summary>
public sealed record StoredPair(string Key, string FirstPath, string SecondPath, float Distance, string Relation);

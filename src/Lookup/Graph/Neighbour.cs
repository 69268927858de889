namespace Lookup.Graph;

/// <summary>One search hit: a node id and its cosine distance (1 − dot of unit vectors, in [0, 2]) to the query.</summary>
public readonly record struct Neighbour(int Id, float Distance);

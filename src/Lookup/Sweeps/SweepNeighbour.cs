namespace Lookup.Sweeps;

/// <summary>A photo found near another one, at cosine distance <paramref name="Distance"/> (1 − dot).</summary>
public readonly record struct SweepNeighbour(int PhotoId, float Distance);

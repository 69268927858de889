namespace Lookup.Sweeps;

/// <summary>
/// Answers "which photos lie within cosine distance r of this one?" for the sweep. The HNSW graph's range search
/// or an exact scan (<see cref="ExactNeighbourSource"/>) can serve it.
/// Implementations must allow concurrent calls from several threads: the sweep queries in parallel.
/// </summary>
public interface INeighbourSource
{
    /// <summary>
    /// Appends to <paramref name="results"/> the photos within <paramref name="radius"/> of photo
    /// <paramref name="photoId"/>, in any order. The photo itself may be included (the sweep drops it), and an
    /// approximate source may miss some: the sweep keeps a pair found from either side.
    /// </summary>
    void FindWithin(int photoId, float radius, List<SweepNeighbour> results);
}

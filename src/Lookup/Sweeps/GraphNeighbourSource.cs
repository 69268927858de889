using Lookup.Graph;

namespace Lookup.Sweeps;

/// <summary>
/// The sweep's neighbour search over the index's HNSW graph: a photo's id is its graph node id, so a query is the
/// node's own vector and each hit's node id names the neighbouring photo (hits that are not photos of this sweep are
/// ignored by the sweep). Recall is that of <see cref="HnswGraph.RangeSearch"/> (an expanding-ef search: not exact
/// above <see cref="HnswParameters.ExactBelow"/> live nodes); the sweep keeps a pair found from either side.
/// Thread safety: any number of threads (the graph's searches are lock-free readers); the graph must not be written
/// meanwhile by this process (a loaded copy is private to the sweep).
/// </summary>
public sealed class GraphNeighbourSource : INeighbourSource
{
    private readonly HnswGraph _graph;

    /// <summary>Searches <paramref name="graph"/>.</summary>
    public GraphNeighbourSource(HnswGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        _graph = graph;
    }

    /// <inheritdoc />
    public void FindWithin(int photoId, float radius, List<SweepNeighbour> results)
    {
        ArgumentNullException.ThrowIfNull(results);
        foreach (var hit in _graph.RangeSearch(_graph.GetVector(photoId), radius))
        {
            // 1 − dot of two unit vectors can round to just below 0 for identical photos.
            results.Add(new SweepNeighbour(hit.Id, Math.Max(0f, hit.Distance)));
        }
    }
}

namespace Lookup.Graph;

/// <summary>
/// Per-thread working memory of a search: the visited tags, the candidate queue, the result heap and a buffer
/// for the normalised query. Each thread gets its own, so concurrent readers share nothing mutable.
/// </summary>
internal sealed class SearchScratch
{
    [ThreadStatic]
    private static SearchScratch? t_current;

    private float[] _query = [];

    public VisitedSet Visited { get; } = new();

    public NeighbourHeap<ClosestFirst> Candidates { get; } = new();

    public NeighbourHeap<FurthestFirst> Results { get; } = new();

    /// <summary>The calling thread's scratch (created on first use).</summary>
    public static SearchScratch ForCurrentThread() => t_current ??= new SearchScratch();

    /// <summary>Normalises <paramref name="query"/> into this thread's query buffer and returns it.</summary>
    public ReadOnlySpan<float> NormalisedQuery(ReadOnlySpan<float> query)
    {
        if (_query.Length < query.Length)
        {
            _query = new float[query.Length];
        }

        var buffer = _query.AsSpan(0, query.Length);
        CosineKernel.Normalize(query, buffer);
        return buffer;
    }

    /// <summary>Empties <see cref="Results"/> into an array sorted closest first, keeping at most <paramref name="k"/>.</summary>
    public Neighbour[] TakeClosest(int k)
    {
        var results = Results;
        while (results.Count > k)
        {
            results.Pop();
        }

        var sorted = new Neighbour[results.Count];
        for (int i = sorted.Length - 1; i >= 0; i--)
        {
            sorted[i] = results.Pop();
        }

        return sorted;
    }
}

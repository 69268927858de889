namespace Lookup.Graph;

/// <summary>
/// The read-side algorithms of Malkov &amp; Yashunin (2018), written once and compiled per storage view:
/// the greedy descent through the upper layers, SEARCH-LAYER (their Algorithm 2) and the k-NN and range
/// searches built on them. Stateless; all working memory comes from the caller's <see cref="SearchScratch"/>.
/// </summary>
internal static class HnswAlgorithm
{
    /// <summary>
    /// Greedy search with ef = 1 from <paramref name="entry"/> on layers <paramref name="fromLevel"/> down to
    /// <paramref name="toLevel"/>: on each layer move to the closest neighbour while that gets closer.
    /// Used by both insertion and search.
    /// </summary>
    public static Neighbour GreedyDescent<TView>(in TView graph, ReadOnlySpan<float> query, Neighbour entry, int fromLevel, int toLevel)
        where TView : struct, IGraphView
    {
        var best = entry;
        for (int level = fromLevel; level >= toLevel; level--)
        {
            bool moved = true;
            while (moved)
            {
                moved = false;
                foreach (int e in graph.Links(best.Id, level))
                {
                    float d = CosineKernel.Distance(query, graph.Vector(e));
                    if (d < best.Distance)
                    {
                        best = new Neighbour(e, d);
                        moved = true;
                    }
                }
            }
        }

        return best;
    }

    /// <summary>
    /// SEARCH-LAYER: best-first search on one layer keeping the <paramref name="ef"/> closest live nodes in
    /// <c>scratch.Results</c>. Tombstones are walked through (they keep the graph navigable) but never enter the results.
    /// </summary>
    public static void SearchLayer<TView>(in TView graph, ReadOnlySpan<float> query, ReadOnlySpan<Neighbour> entryPoints, int ef, int level, SearchScratch scratch)
        where TView : struct, IGraphView
    {
        var visited = scratch.Visited;
        var candidates = scratch.Candidates;
        var results = scratch.Results;
        visited.Reset(graph.NodeLimit);
        candidates.Clear();
        results.Clear();
        foreach (var ep in entryPoints)
        {
            if (visited.TryVisit(ep.Id))
            {
                candidates.Push(ep);
                if (!graph.IsDeleted(ep.Id))
                {
                    results.Push(ep);
                }
            }
        }

        while (results.Count > ef)
        {
            results.Pop();
        }

        while (candidates.Count > 0)
        {
            var c = candidates.Pop();
            if (results.Count >= ef && c.Distance > results.Top.Distance)
            {
                break;
            }

            var links = graph.Links(c.Id, level);
            if (links.Length > 0)
            {
                graph.Prefetch(links[0]);
            }

            for (int i = 0; i < links.Length; i++)
            {
                int e = links[i];
                if (i + 1 < links.Length)
                {
                    graph.Prefetch(links[i + 1]);
                }

                if (!visited.TryVisit(e))
                {
                    continue;
                }

                float d = CosineKernel.Distance(query, graph.Vector(e));
                if (results.Count < ef || d < results.Top.Distance)
                {
                    candidates.Push(new Neighbour(e, d));
                    if (!graph.IsDeleted(e))
                    {
                        results.Push(new Neighbour(e, d));
                        if (results.Count > ef)
                        {
                            results.Pop();
                        }
                    }
                }
            }
        }
    }

    /// <summary>K-NN-SEARCH (their Algorithm 5): descend greedily to layer 1, then SEARCH-LAYER on layer 0 with max(ef, k).</summary>
    public static Neighbour[] Search<TView>(in TView graph, EntryPoint entry, ReadOnlySpan<float> unitQuery, int k, int ef, SearchScratch scratch)
        where TView : struct, IGraphView
    {
        if (entry.IsNone || k <= 0)
        {
            return [];
        }

        var ep = DescendToLayerZero(graph, entry, unitQuery);
        SearchLayer(graph, unitQuery, [ep], Math.Max(ef, k), 0, scratch);
        return scratch.TakeClosest(k);
    }

    /// <summary>
    /// All live nodes within <paramref name="radius"/>, by an expanding-ef search: run SEARCH-LAYER with ef,
    /// and while the ef-th result still lies inside the radius (so more may), double ef and search again.
    /// Trade-off: recall equals that of a k-NN search with the final ef (high when ef is well above the number of
    /// hits, as the doubling ensures), at roughly twice the cost of that one search; it is not exact, and a hit
    /// cut off from the entry region by a sparse stretch of the graph can be missed. Use the exact scan where
    /// completeness matters more than time.
    /// </summary>
    public static Neighbour[] RangeSearch<TView>(in TView graph, EntryPoint entry, ReadOnlySpan<float> unitQuery, float radius, int startEf, int liveCount, SearchScratch scratch)
        where TView : struct, IGraphView
    {
        if (entry.IsNone || liveCount == 0)
        {
            return [];
        }

        var ep = DescendToLayerZero(graph, entry, unitQuery);
        int ef = Math.Max(startEf, 16);
        while (true)
        {
            SearchLayer(graph, unitQuery, [ep], ef, 0, scratch);
            var results = scratch.Results;
            bool mayHaveMore = results.Count >= ef && results.Top.Distance <= radius && ef < liveCount;
            if (!mayHaveMore)
            {
                break;
            }

            ef = (int)Math.Min(2L * ef, liveCount);
        }

        while (scratch.Results.Count > 0 && scratch.Results.Top.Distance > radius)
        {
            scratch.Results.Pop();
        }

        return scratch.TakeClosest(int.MaxValue);
    }

    private static Neighbour DescendToLayerZero<TView>(in TView graph, EntryPoint entry, ReadOnlySpan<float> unitQuery)
        where TView : struct, IGraphView
    {
        var ep = new Neighbour(entry.Id, CosineKernel.Distance(unitQuery, graph.Vector(entry.Id)));
        return GreedyDescent(graph, unitQuery, ep, entry.Level, 1);
    }
}

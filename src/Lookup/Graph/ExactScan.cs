namespace Lookup.Graph;

/// <summary>Brute-force k-NN and range search over contiguous unit vectors: the exact answer every graph search is checked against.</summary>
internal static class ExactScan
{
    /// <summary>The <paramref name="k"/> closest live vectors among the first <paramref name="count"/>, closest first.</summary>
    public static Neighbour[] TopK(ReadOnlySpan<float> vectors, ReadOnlySpan<bool> deleted, int dimension, int count, ReadOnlySpan<float> unitQuery, int k, SearchScratch scratch)
    {
        var results = scratch.Results;
        results.Clear();
        if (k <= 0)
        {
            return [];
        }

        for (int id = 0; id < count; id++)
        {
            if (deleted[id])
            {
                continue;
            }

            float d = CosineKernel.Distance(unitQuery, vectors.Slice(id * dimension, dimension));
            if (results.Count < k)
            {
                results.Push(new Neighbour(id, d));
            }
            else if (d < results.Top.Distance)
            {
                results.Pop();
                results.Push(new Neighbour(id, d));
            }
        }

        return scratch.TakeClosest(k);
    }

    /// <summary>Every live vector within <paramref name="radius"/>, closest first.</summary>
    public static Neighbour[] Within(ReadOnlySpan<float> vectors, ReadOnlySpan<bool> deleted, int dimension, int count, ReadOnlySpan<float> unitQuery, float radius)
    {
        var hits = new List<Neighbour>();
        for (int id = 0; id < count; id++)
        {
            if (!deleted[id])
            {
                float d = CosineKernel.Distance(unitQuery, vectors.Slice(id * dimension, dimension));
                if (d <= radius)
                {
                    hits.Add(new Neighbour(id, d));
                }
            }
        }

        hits.Sort(static (a, b) => a.Distance != b.Distance ? a.Distance.CompareTo(b.Distance) : a.Id.CompareTo(b.Id));
        return [.. hits];
    }
}

using Lookup.Graph;

namespace Lookup.Tests.Graph;

/// <summary>recall@k: the share of the exact k nearest ids that a search also returned (common practice in ANN benchmarks).</summary>
internal static class Recall
{
    public static double AtK(INearestSearch approximate, INearestSearch exact, IReadOnlyList<float[]> queries, int k, int? ef = null)
    {
        long found = 0, wanted = 0;
        foreach (var q in queries)
        {
            var truth = exact.Search(q, k).Select(n => n.Id).ToHashSet();
            found += approximate.Search(q, k, ef).Count(n => truth.Contains(n.Id));
            wanted += truth.Count;
        }

        return wanted == 0 ? 1.0 : (double)found / wanted;
    }
}

using System.Diagnostics;

namespace Lookup.Bench;

/// <summary>Timing helpers: every figure is single-threaded wall time after a warm-up.</summary>
internal static class Measure
{
    public static double Seconds(Action action)
    {
        var watch = Stopwatch.StartNew();
        action();
        return watch.Elapsed.TotalSeconds;
    }

    /// <summary>Queries per second of <paramref name="search"/> over all queries, after warming up on a few.</summary>
    public static double Qps(float[][] queries, Action<float[]> search)
    {
        for (int i = 0; i < Math.Min(200, queries.Length); i++)
        {
            search(queries[i]);
        }

        var watch = Stopwatch.StartNew();
        foreach (var q in queries)
        {
            search(q);
        }

        return queries.Length / watch.Elapsed.TotalSeconds;
    }

    public static double RecallAt10(int[][] truth, int[][] found)
    {
        long hit = 0, want = 0;
        for (int i = 0; i < truth.Length; i++)
        {
            var t = truth[i].ToHashSet();
            hit += found[i].Count(t.Contains);
            want += t.Count;
        }

        return (double)hit / want;
    }
}

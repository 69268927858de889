using System.Globalization;
using Lookup.Graph;

namespace Lookup.Bench;

/// <summary>Where brute force stops being as fast as the graph: QPS of both at growing sizes (EfSearch 64).</summary>
internal sealed record Crossover(IReadOnlyList<(int Count, double ExactQps, double GraphQps, double GraphRecall)> Points)
{
    /// <summary>The largest measured size at which the exact scan was at least as fast as the graph.</summary>
    public int CrossoverCount => Points.Where(p => p.ExactQps >= p.GraphQps).Select(p => p.Count).DefaultIfEmpty(0).Max();

    public static Crossover Measure(float[][] data, float[][] queries, bool quick)
    {
        int[] sizes = quick ? [250, 500, 1000, 2000] : [250, 500, 1000, 2000, 4000, 8000];
        var points = new List<(int, double, double, double)>();
        foreach (int n in sizes.Where(s => s <= data.Length))
        {
            var graph = new HnswGraph(data[0].Length, new HnswParameters(ExactBelow: 0), n);
            var exact = new ExactSearch(data[0].Length, n);
            for (int i = 0; i < n; i++)
            {
                graph.Add(data[i]);
                exact.Add(data[i]);
            }

            double exactQps = Bench.Measure.Qps(queries, q => exact.Search(q, 10));
            double graphQps = Bench.Measure.Qps(queries, q => graph.Search(q, 10));
            var truth = queries.Select(q => exact.Search(q, 10).Select(h => h.Id).ToArray()).ToArray();
            var found = queries.Select(q => graph.Search(q, 10).Select(h => h.Id).ToArray()).ToArray();
            points.Add((n, exactQps, graphQps, Bench.Measure.RecallAt10(truth, found)));
        }

        return new Crossover(points);
    }

    public void Print()
    {
        Console.WriteLine();
        Console.WriteLine($"{"n",6} {"exact QPS",10} {"graph QPS",10} {"graph recall@10",15}   (EfSearch 64)");
        foreach (var (count, exactQps, graphQps, recall) in Points)
        {
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{count,6} {exactQps,10:F0} {graphQps,10:F0} {recall,15:F4}"));
        }

        Console.WriteLine($"exact scan at least as fast up to n = {CrossoverCount}");
    }
}

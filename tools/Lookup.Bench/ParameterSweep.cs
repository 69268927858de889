using System.Globalization;
using Lookup.Graph;

namespace Lookup.Bench;

/// <summary>`params`: build rate, recall@10 and latency of our graph on the real vectors for a grid of M and EfConstruction, at several EfSearch.</summary>
internal static class ParameterSweep
{
    public static int Run(bool quick)
    {
        int count = quick ? 2_000 : 10_000;
        var data = Datasets.Real("train", count);
        var queries = Datasets.Real("t10k", quick ? 200 : 1_000);
        var exact = new ExactSearch(data[0].Length, count);
        foreach (var v in data)
        {
            exact.Add(v);
        }

        var truth = queries.Select(q => exact.Search(q, 10).Select(n => n.Id).ToArray()).ToArray();
        Console.WriteLine($"real-{count / 1000}k, one thread");
        Console.WriteLine($"{"M",3} {"EfC",4} {"build vec/s",11} {"EfSearch",8} {"recall@10",9} {"latency µs",10}");
        foreach (int m in new[] { 8, 16, 32 })
        {
            foreach (int efConstruction in new[] { 64, 128, 256 })
            {
                var graph = new HnswGraph(data[0].Length, new HnswParameters(M: m, EfConstruction: efConstruction, ExactBelow: 0), count);
                double build = Measure.Seconds(() =>
                {
                    foreach (var v in data)
                    {
                        graph.Add(v);
                    }
                });
                foreach (int ef in new[] { 16, 32, 64, 128 })
                {
                    double qps = Measure.Qps(queries, q => graph.Search(q, 10, ef));
                    var found = queries.Select(q => graph.Search(q, 10, ef).Select(n => n.Id).ToArray()).ToArray();
                    Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{m,3} {efConstruction,4} {count / build,11:F0} {ef,8} {Measure.RecallAt10(truth, found),9:F4} {1e6 / qps,10:F0}"));
                }
            }
        }

        return 0;
    }
}

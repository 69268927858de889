using System.Globalization;
using System.Text.Json;
using Lookup.Graph;

namespace Lookup.Bench;

/// <summary>
/// `graph`: our HNSW against the native peer on the same vectors (M 16, EfConstruction 128, one thread):
/// build rate, and QPS with recall@10 against brute force at EfSearch 16/32/64/128; the exact-scan
/// crossover; the cold open-and-query time of a persisted graph.
/// </summary>
internal static class GraphBench
{
    private static readonly int[] EfValues = [16, 32, 64, 128];
    private const int K = 10;

    public static int Run(bool quick)
    {
        int realCount = quick ? 2_000 : 10_000;
        int queryCount = quick ? 200 : 1_000;
        int syntheticCount = quick ? 10_000 : 100_000;
        var parameters = new HnswParameters(M: 16, EfConstruction: 128, ExactBelow: 0);
        Console.Error.WriteLine($"peer acceleration: {PeerIndex.Acceleration}; .NET {Environment.Version}; Vector512 {System.Runtime.Intrinsics.Vector512.IsHardwareAccelerated}");

        var train = Datasets.Real("train", realCount);
        var test = Datasets.Real("t10k", queryCount);
        var rows = new List<ResultRow>();
        var bruteQps = new Dictionary<string, double>();
        string realName = $"real-{realCount / 1000}k";
        RunDataset(realName, train, test, parameters, rows, bruteQps, out _);

        var synthetic = Datasets.Noisy(train, syntheticCount, 0.01, seed: 1);
        var syntheticQueries = Datasets.Noisy(test, queryCount, 0.01, seed: 2);
        string syntheticName = $"noisy-{syntheticCount / 1000}k";
        RunDataset(syntheticName, synthetic, syntheticQueries, parameters, rows, bruteQps, out var syntheticGraph);

        var crossover = Crossover.Measure(train, test, quick);
        var persisted = PersistedBench.Run(syntheticGraph, syntheticQueries, quick);

        PrintTable(rows, bruteQps);
        crossover.Print();
        persisted.Print();
        Console.WriteLine(Json(quick, rows, bruteQps, crossover, persisted));
        return 0;
    }

    private static void RunDataset(string name, float[][] data, float[][] queries, HnswParameters parameters, List<ResultRow> rows, Dictionary<string, double> bruteQps, out HnswGraph graph)
    {
        Console.Error.WriteLine($"{name}: {data.Length} vectors, {queries.Length} queries");
        var exact = new ExactSearch(data[0].Length, data.Length);
        foreach (var v in data)
        {
            exact.Add(v);
        }

        var truth = new int[queries.Length][];
        bruteQps[name] = Measure.Qps(queries, q => exact.Search(q, K));
        for (int i = 0; i < queries.Length; i++)
        {
            truth[i] = [.. exact.Search(queries[i], K).Select(n => n.Id)];
        }

        var ours = new HnswGraph(data[0].Length, parameters, data.Length);
        double ourBuild = Measure.Seconds(() =>
        {
            foreach (var v in data)
            {
                ours.Add(v);
            }
        });
        Console.Error.WriteLine($"  ours built in {ourBuild:F1} s; integrity {ours.CheckIntegrity()}");

        using var peer = new PeerIndex(data[0].Length, parameters.M, parameters.EfConstruction, 64);
        double peerBuild = Measure.Seconds(() =>
        {
            for (int i = 0; i < data.Length; i++)
            {
                peer.Add(i, data[i]);
            }
        });
        Console.Error.WriteLine($"  peer built in {peerBuild:F1} s");

        foreach (int ef in EfValues)
        {
            var found = new int[queries.Length][];
            double qps = Measure.Qps(queries, q => ours.Search(q, K, ef));
            for (int i = 0; i < queries.Length; i++)
            {
                found[i] = [.. ours.Search(queries[i], K, ef).Select(n => n.Id)];
            }

            rows.Add(new ResultRow(name, "lookup", data.Length, ourBuild, ef, Measure.RecallAt10(truth, found), qps));

            peer.SetEfSearch(ef);
            double peerQps = Measure.Qps(queries, q => peer.Search(q, K, out _, out _));
            for (int i = 0; i < queries.Length; i++)
            {
                peer.Search(queries[i], K, out var keys, out _);
                found[i] = [.. keys.Select(k => (int)k)];
            }

            rows.Add(new ResultRow(name, "peer", data.Length, peerBuild, ef, Measure.RecallAt10(truth, found), peerQps));
        }

        graph = ours;
    }

    private static void PrintTable(List<ResultRow> rows, Dictionary<string, double> bruteQps)
    {
        Console.WriteLine();
        Console.WriteLine($"{"dataset",-10} {"engine",-7} {"n",7} {"build vec/s",11} {"ef",4} {"recall@10",9} {"QPS",8} {"latency µs",10}");
        foreach (var r in rows)
        {
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{r.Dataset,-10} {r.Engine,-7} {r.Count,7} {r.BuildRate,11:F0} {r.Ef,4} {r.Recall,9:F4} {r.Qps,8:F0} {1e6 / r.Qps,10:F0}"));
        }

        foreach (var (name, qps) in bruteQps)
        {
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{name,-10} {"exact",-7} {"",7} {"",11} {"",4} {1.0,9:F4} {qps,8:F0} {1e6 / qps,10:F0}"));
        }
    }

    private static string Json(bool quick, List<ResultRow> rows, Dictionary<string, double> bruteQps, Crossover crossover, PersistedBench persisted)
    {
        var datasets = rows.GroupBy(r => r.Dataset).Select(g =>
        {
            var ours = g.Where(r => r.Engine == "lookup").ToList();
            var peer = g.Where(r => r.Engine == "peer").ToList();
            return new Dictionary<string, object>
            {
                ["name"] = g.Key,
                ["n"] = ours[0].Count,
                ["build_rate"] = Math.Round(ours[0].BuildRate),
                ["peer_build_rate"] = Math.Round(peer[0].BuildRate),
                ["build_ratio"] = Math.Round(ours[0].BuildRate / peer[0].BuildRate, 3),
                ["exact_qps"] = Math.Round(bruteQps[g.Key]),
                ["ef"] = ours.Zip(peer).Select(p => new Dictionary<string, object>
                {
                    ["ef"] = p.First.Ef,
                    ["recall"] = Math.Round(p.First.Recall, 4),
                    ["peer_recall"] = Math.Round(p.Second.Recall, 4),
                    ["qps"] = Math.Round(p.First.Qps),
                    ["peer_qps"] = Math.Round(p.Second.Qps),
                    ["qps_ratio"] = Math.Round(p.First.Qps / p.Second.Qps, 3),
                    ["qps_ratio_at_equal_recall"] = EqualRecallRatio(ours, p.Second) ?? double.NaN,
                }).ToList(),
            };
        }).ToList();
        return JsonSerializer.Serialize(new Dictionary<string, object>
        {
            ["bench"] = "graph",
            ["quick"] = quick,
            ["m"] = 16,
            ["ef_construction"] = 128,
            ["datasets"] = datasets,
            ["exact_crossover_n"] = crossover.CrossoverCount,
            ["persisted_n"] = persisted.Count,
            ["persisted_save_s"] = Math.Round(persisted.SaveSeconds, 1),
            ["persisted_open_ms"] = Math.Round(persisted.OpenMilliseconds, 1),
            ["persisted_cold_query_ms"] = Math.Round(persisted.ColdQueryMilliseconds, 1),
            ["persisted_warm_qps"] = Math.Round(persisted.WarmQps),
            ["persisted_load_all_s"] = Math.Round(persisted.LoadAllSeconds, 1),
            ["persisted_identical"] = persisted.Identical,
        }, new JsonSerializerOptions { NumberHandling = System.Text.Json.Serialization.JsonNumberHandling.AllowNamedFloatingPointLiterals });
    }

    /// <summary>Our QPS at the smallest ef whose recall reaches the peer's, over the peer's QPS (null when no ef of ours reaches it).</summary>
    private static double? EqualRecallRatio(List<ResultRow> ours, ResultRow peer)
    {
        var match = ours.Where(r => r.Recall >= peer.Recall).OrderBy(r => r.Ef).FirstOrDefault();
        return match is null ? null : Math.Round(match.Qps / peer.Qps, 3);
    }
}

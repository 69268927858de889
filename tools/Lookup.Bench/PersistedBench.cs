using System.Diagnostics;
using System.Globalization;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Bench;

/// <summary>
/// A graph saved to an index file, then opened in-process by a fresh read-only handle and queried once (the
/// operating system's file cache is warm: the file was just written). Also: save time, bulk load time, and
/// whether the lazily read graph answers exactly as the in-memory one.
/// </summary>
internal sealed record PersistedBench(int Count, double SaveSeconds, double OpenMilliseconds, double ColdQueryMilliseconds, double WarmQps, int NodesRead, double LoadAllSeconds, bool Identical, long FileBytes)
{
    public static PersistedBench Run(HnswGraph graph, float[][] queries, bool quick)
    {
        string path = Path.Combine(Datasets.CacheDirectory, $"persisted-{graph.Count}.lookup");
        foreach (var stale in new[] { path, IndexFile.JournalPathFor(path), path + ".lock", path + ".readers" })
        {
            File.Delete(stale);
        }

        double save = Bench.Measure.Seconds(() =>
        {
            using var file = IndexFile.Open(path, IndexAccess.Write);
            new GraphStore(file).Save(graph, "bench-synthetic");
        });

        var opens = new List<double>();
        var firsts = new List<double>();
        int nodesRead = 0;
        bool identical = true;
        double warmQps = 0;
        for (int trial = 0; trial < (quick ? 3 : 5); trial++)
        {
            var watch = Stopwatch.StartNew();
            using var file = IndexFile.Open(path, IndexAccess.Read);
            var lazy = new GraphStore(file).OpenLazy("bench-synthetic");
            opens.Add(watch.Elapsed.TotalMilliseconds);
            var hits = lazy.Search(queries[trial], 10);
            firsts.Add(watch.Elapsed.TotalMilliseconds);
            nodesRead = lazy.VectorsLoaded;
            var second = Stopwatch.StartNew();
            _ = lazy.Search(queries[trial + 10], 10);
            Console.Error.WriteLine($"  trial {trial}: open {opens[^1]:F1} ms, first query done at {firsts[^1]:F1} ms, a second query {second.Elapsed.TotalMilliseconds:F1} ms");
            identical &= hits.SequenceEqual(graph.Search(queries[trial], 10));
            if (trial == 0)
            {
                var rest = queries.Skip(1).Take(quick ? 100 : 300).ToArray();
                warmQps = Bench.Measure.Qps(rest, q => lazy.Search(q, 10));
                identical &= rest.All(q => lazy.Search(q, 10).SequenceEqual(graph.Search(q, 10)));
            }
        }

        double load = Bench.Measure.Seconds(() =>
        {
            using var file = IndexFile.Open(path, IndexAccess.Read);
            _ = new GraphStore(file).Load();
        });
        opens.Sort();
        firsts.Sort();
        return new PersistedBench(graph.Count, save, opens[opens.Count / 2], firsts[firsts.Count / 2], warmQps, nodesRead, load, identical, new FileInfo(path).Length);
    }

    /// <summary>`persisted`: fresh open + first query on the file the last full `graph` run saved (no rebuild).</summary>
    public static int Reopen()
    {
        string path = Path.Combine(Datasets.CacheDirectory, "persisted-100000.lookup");
        var queries = Datasets.Noisy(Datasets.Real("t10k", 1_000), 1_000, 0.01, seed: 2);
        var times = new List<double>();
        for (int trial = 0; trial < 9; trial++)
        {
            var watch = Stopwatch.StartNew();
            using var file = IndexFile.Open(path, IndexAccess.Read);
            var lazy = new GraphStore(file).OpenLazy();
            _ = lazy.Search(queries[trial], 10);
            times.Add(watch.Elapsed.TotalMilliseconds);
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"fresh open + first query: {times[^1]:F1} ms ({lazy.VectorsLoaded} vectors read)"));
        }

        times.Sort();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"median {times[times.Count / 2]:F1} ms, best {times[0]:F1} ms; load average {File.ReadAllText("/proc/loadavg").Split(' ')[0]}"));
        return 0;
    }

    public void Print()
    {
        Console.WriteLine();
        Console.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"persisted {Count} nodes: save {SaveSeconds:F1} s, file {FileBytes / 1e6:F0} MB; fresh open {OpenMilliseconds:F1} ms, open + first query {ColdQueryMilliseconds:F1} ms (median, {NodesRead} vectors read); then {WarmQps:F0} QPS with its cache; load all {LoadAllSeconds:F1} s; answers identical to in-memory: {Identical}"));
    }
}

using System.Diagnostics;
using System.Globalization;
using System.Security.Cryptography;
using Lookup.Catalogue;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Bench;

/// <summary>
/// <c>lookup merge</c> at catalogue scale: 100,000 synthetic 512-float embeddings (1,000 random unit centres plus
/// N(0, 0.02²) per component, renormalised: clusters about as tight as views of one product) split by
/// <see cref="ShardSpec"/> into part indexes written as ingest writes them (records with 1 KB thumbnails, graph,
/// settings), then merged: into a new index (bulk build + <see cref="GraphStore.Save"/>), the same parts again
/// (nothing to do), and the last part into an index holding the others (incremental). The parts are cached under
/// tools/bench/cache/ because building them is itself a 100k graph build. --quick: 10,000 vectors.
/// </summary>
internal static class MergeBench
{
    private const int Dimension = 512;
    private const string Fingerprint = "bench-merge-synthetic";

    public static int Run(string[] args)
    {
        bool quick = args.Contains("--quick");
        int count = quick ? 10_000 : 100_000;
        int parts = OptionValue(args, "--parts") ?? 4;
        Console.Error.WriteLine($"merge bench: {count:N0} vectors in {parts} parts ({Environment.ProcessorCount} cores, load {LoadAverage()})");

        var vectors = Vectors(count);
        var partPaths = EnsureParts(vectors, parts);
        string work = Path.Combine(Datasets.CacheDirectory, $"merge-{count}-{parts}-work");
        Directory.CreateDirectory(work);
        string target = Fresh(Path.Combine(work, "merged.lookup"));

        var bulk = Timed(target, partPaths, out var stages);
        var again = Timed(target, partPaths, out _);
        string incremental = Fresh(Path.Combine(work, "incremental.lookup"));
        Timed(incremental, partPaths[..^1], out _);
        var last = Timed(incremental, partPaths[^1..], out var lastStages);
        double recall = Recall(target, vectors);

        Console.WriteLine();
        Console.WriteLine($"| merge ({count:N0} vectors, {parts} parts) | photos | wall s | graph vectors/s | notes |");
        Console.WriteLine("| --- | ---: | ---: | ---: | --- |");
        Console.WriteLine(Row("into a new index (bulk build + Save)", bulk, $"read {stages["reading"]:F1} s, build {stages["building"]:F1} s, write records + Save {stages["writing"]:F1} s"));
        Console.WriteLine(Row("the same parts again", again, $"{again.Unchanged:N0} unchanged, nothing written"));
        Console.WriteLine(Row($"last part into an index of {count - last.Added:N0}", last, $"load + insert {lastStages["writing"]:F1} s"));
        Console.WriteLine();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"recall@10 of the merged graph at EfSearch 64 against exact search, 200 queries: {recall:F4}; peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / (1 << 20):N0} MB"));
        return 0;
    }

    private static string Row(string what, MergeSummary s, string notes) => string.Create(CultureInfo.InvariantCulture,
        $"| {what} | {s.RecordsRead:N0} | {s.Elapsed.TotalSeconds:F1} | {(s.VectorsInserted > 0 ? s.VectorsPerSecond.ToString("N0", CultureInfo.InvariantCulture) : "-")} | {notes} |");

    private static MergeSummary Timed(string target, string[] parts, out Dictionary<string, double> stageSeconds)
    {
        var clock = Stopwatch.StartNew();
        var firstSeen = new Dictionary<string, double>();
        var progress = new Inline(p => firstSeen.TryAdd(p.Stage, clock.Elapsed.TotalSeconds));
        MergeSummary summary;
        using (var file = IndexFile.Open(target, IndexAccess.Write))
        {
            summary = new IndexMerge(file).Run(parts, progress);
        }

        double end = clock.Elapsed.TotalSeconds;
        var order = new[] { "reading", "building", "writing" }.Where(firstSeen.ContainsKey).ToList();
        stageSeconds = order.Select((stage, i) => (stage, (i + 1 < order.Count ? firstSeen[order[i + 1]] : end) - firstSeen[stage]))
            .ToDictionary(x => x.stage, x => x.Item2);
        foreach (var stage in new[] { "reading", "building", "writing" })
        {
            stageSeconds.TryAdd(stage, 0);
        }

        Console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"  {Path.GetFileName(target)} ← {parts.Length} part(s): {summary.Elapsed.TotalSeconds:F1} s, added {summary.Added:N0}, unchanged {summary.Unchanged:N0}, {summary.VectorsPerSecond:N0} vectors/s"));
        return summary;
    }

    private static float[][] Vectors(int count)
    {
        var random = new Random(20_261_202);
        var centres = new float[1_000][];
        for (int c = 0; c < centres.Length; c++)
        {
            centres[c] = [.. Enumerable.Range(0, Dimension).Select(_ => (float)((random.NextDouble() * 2) - 1))];
            CosineKernel.Normalize(centres[c], centres[c]);
        }

        return Datasets.Noisy(centres, count, sigma: 0.02, seed: 7);
    }

    private static string PathOf(int i) => $"SKU-{i / 3:D6}/view-{i % 3}.jpg";

    private static string[] EnsureParts(float[][] vectors, int parts)
    {
        string folder = Path.Combine(Datasets.CacheDirectory, $"merge-{vectors.Length}-{parts}");
        var paths = Enumerable.Range(1, parts).Select(k => Path.Combine(folder, $"part-{k}.lookup")).ToArray();
        if (File.Exists(Path.Combine(folder, "complete")))
        {
            return paths;
        }

        Directory.CreateDirectory(folder);
        var clock = Stopwatch.StartNew();
        for (int k = 1; k <= parts; k++)
        {
            var shard = new ShardSpec(k, parts);
            var mine = Enumerable.Range(0, vectors.Length).Where(i => shard.Contains(PathOf(i))).ToList();
            Fresh(paths[k - 1]);
            using var file = IndexFile.Open(paths[k - 1], IndexAccess.Write);
            var graph = new HnswGraph(Dimension, new HnswParameters(), mine.Count);
            var records = mine.Select(i => Record(i, graph.Add(vectors[i]))).ToList();
            var table = new PhotoTable(file);
            for (int start = 0; start < records.Count; start += 5_000)
            {
                var batch = records.Skip(start).Take(5_000).ToList();
                file.InTransaction(() => batch.ForEach(table.Upsert));
            }

            file.InTransaction(() => new CatalogueSettings("/srv/bench-catalogue", "folder", "{}", Fingerprint, DateTime.UtcNow).Write(file));
            new GraphStore(file).Save(graph, Fingerprint);
            Console.Error.WriteLine($"  wrote part {k}/{parts}: {mine.Count:N0} photos ({clock.Elapsed.TotalSeconds:F0} s so far)");
        }

        File.WriteAllText(Path.Combine(folder, "complete"), "");
        return paths;
    }

    private static PhotoRecord Record(int i, int node) => new()
    {
        Path = PathOf(i),
        Sku = $"SKU-{i / 3:D6}",
        Size = 400_000 + i,
        MtimeUtcTicks = new DateTime(2026, 1, 1, 0, 0, 0, DateTimeKind.Utc).Ticks + i,
        Sha256 = Convert.ToHexStringLower(SHA256.HashData(BitConverter.GetBytes(i))),
        Status = PhotoStatus.Indexed,
        NodeId = node,
        Width = 1600,
        Height = 1200,
        Format = "JPEG",
        DHash = (ulong)i * 0x9E3779B97F4A7C15UL,
        Thumbnail = [.. Enumerable.Range(0, 1024).Select(b => (byte)(b ^ i))],
        UpdatedUtc = new DateTime(2026, 1, 2, 0, 0, 0, DateTimeKind.Utc),
    };

    private static double Recall(string target, float[][] vectors)
    {
        using var file = IndexFile.Open(target, IndexAccess.Read);
        var graph = new GraphStore(file).Load();
        var exact = new ExactSearch(Dimension);
        for (int id = 0; id < graph.Count; id++)
        {
            exact.Add(graph.GetVector(id));
        }

        var queries = Datasets.Noisy(vectors[..200], 200, sigma: 0.02, seed: 11);
        var truth = queries.Select(q => exact.Search(q, 10).Select(n => n.Id).ToArray()).ToArray();
        var found = queries.Select(q => graph.Search(q, 10).Select(n => n.Id).ToArray()).ToArray();
        return Measure.RecallAt10(truth, found);
    }

    private static string Fresh(string path)
    {
        foreach (var stale in new[] { path, IndexFile.JournalPathFor(path), path + ".lock", path + ".readers" })
        {
            File.Delete(stale);
        }

        return path;
    }

    private static int? OptionValue(string[] args, string name)
    {
        int at = Array.IndexOf(args, name);
        return at >= 0 && at + 1 < args.Length ? int.Parse(args[at + 1], CultureInfo.InvariantCulture) : null;
    }

    private static string LoadAverage() =>
        File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Split(' ')[0] : "unknown";

    private sealed class Inline(Action<MergeProgress> report) : IProgress<MergeProgress>
    {
        public void Report(MergeProgress value) => report(value);
    }
}

using System.Diagnostics;
using System.Globalization;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Matching;

namespace Lookup.Bench;

/// <summary>
/// Where the time of one <c>lookup match</c> goes, stage by stage, in one fresh process as the command runs them
/// (so every stage pays its first-call costs, as the command does): model fingerprint (SHA-256 of the ONNX files),
/// network session, mean-image folding, index open, decode + crops, embedding the crops on all cores, search and
/// ranking. Wall and CPU time (this process, all threads) per stage.
/// Usage: <c>match-stages --index FILE --photo PHOTO [--crops none|standard|dense]</c>.
/// </summary>
internal static class MatchStages
{
    public static int Run(string[] args)
    {
        string index = Option(args, "--index") ?? throw new ArgumentException("--index FILE is required");
        string photo = Option(args, "--photo") ?? throw new ArgumentException("--photo PHOTO is required");
        var crops = Enum.Parse<CropSet>(Option(args, "--crops") ?? "dense", ignoreCase: true);
        int workers = Environment.ProcessorCount;
        var rows = new List<string>();
        var total = Stopwatch.StartNew();
        var cpuAtStart = Process.GetCurrentProcess().TotalProcessorTime;
        var card = ModelCard.Default;
        int threads = QueryCrops.Count(crops) >= workers ? 1 : workers;

        Stage(rows, "model fingerprint (SHA-256 of the ONNX files)", () => ModelFingerprint.Compute(card));
        Stage(rows, $"network session ({threads} intra-op)", () =>
        {
            using var options = OnnxSessions.CreateOptions(threads);
            using var session = OnnxSessions.Open(card.OnnxFile, options);
        });
        Stage(rows, "mean image (preprocessing model run twice)", () =>
        {
            using var options = OnnxSessions.CreateOptions(threads);
            _ = MeanImageFolding.ReadMeanImage(card, options);
        });
        ImageEmbedder? embedder = null;
        Stage(rows, "ImageEmbedder.Load again (all of the above, files cached)", () => embedder = ImageEmbedder.Load(card, new EmbedderOptions { IntraOpThreads = threads }));
        MatchIndex? opened = null;
        Stage(rows, "index open (snapshot, lazy graph, settings)", () => opened = MatchIndex.Open(index));
        using var matchIndex = opened!;
        using var model = embedder!;
        PreparedQuery? prepared = null;
        Stage(rows, $"read, hash, decode, {QueryCrops.Count(crops)} regions", () => prepared = new QueryReader(new PhotoDecoder()).Read(photo, crops));
        using var query = prepared!;
        QueryPhoto[]? embedded = null;
        Stage(rows, $"embed {query.Regions.Length} regions on {workers} workers", () => embedded = CropEmbedding.Embed([query], model, workers));
        var crops0 = embedded!.SelectMany(p => p.Crops).ToArray();
        using (var fresh = MatchIndex.Open(index))
        {
            int hits = 0;
            Stage(rows, $"search {crops0.Length} regions, k 32 (fresh index: cold node caches)", () =>
                Parallel.For(0, crops0.Length, new ParallelOptions { MaxDegreeOfParallelism = workers }, i => Interlocked.Add(ref hits, fresh.Nearest(crops0[i], 32).Length)));
            rows.Add(Invariant($"| (that search read {fresh.VectorsRead:N0} node vectors and found {hits:N0} hits) | | |"));
            Stage(rows, "SKU lookups and exact scores after that search (SkuRanker.Rank, node caches warm)", () =>
                new SkuRanker(fresh, fresh.Thresholds, new RankingOptions { Workers = workers }).Rank(embedded!, 5));
        }

        using (var fresh = MatchIndex.Open(index))
        {
            Stage(rows, "search and rank together (another fresh index)", () =>
                new SkuRanker(fresh, fresh.Thresholds, new RankingOptions { Workers = workers }).Rank(embedded!, 5));
        }

        MatchRun? run = null;
        Stage(rows, "whole match again (decode, embed, search, rank; warm)", () =>
            run = new PartMatcher(matchIndex, new PhotoDecoder()).MatchFiles([photo], new MatchRequest(5, crops, false, workers), () => model));

        Console.WriteLine($"match stages: {photo}, crops {crops}, index {index} ({matchIndex.LivePhotos:N0} photos), {workers} cores, load {File.ReadAllText("/proc/loadavg").Split(' ')[0]}");
        Console.WriteLine();
        Console.WriteLine("| stage | wall ms | CPU ms |");
        Console.WriteLine("| --- | ---: | ---: |");
        rows.ForEach(Console.WriteLine);
        Console.WriteLine(Invariant($"| in-process total | {total.Elapsed.TotalMilliseconds:0} | {(Process.GetCurrentProcess().TotalProcessorTime - cpuAtStart).TotalMilliseconds:0} |"));
        Console.WriteLine();
        Console.WriteLine($"top SKU: {run!.Answers[0].Ranking[0].Sku} ({run.Answers[0].Ranking[0].Distance:0.000})");
        return 0;
    }

    private static void Stage(List<string> rows, string name, Action action)
    {
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        long start = Stopwatch.GetTimestamp();
        action();
        double wall = Stopwatch.GetElapsedTime(start).TotalMilliseconds;
        double used = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalMilliseconds;
        rows.Add(Invariant($"| {name} | {wall:0} | {used:0} |"));
    }

    private static string? Option(string[] args, string name)
    {
        int at = Array.IndexOf(args, name);
        return at >= 0 && at + 1 < args.Length ? args[at + 1] : null;
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

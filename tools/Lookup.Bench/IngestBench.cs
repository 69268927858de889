using System.Diagnostics;
using System.Globalization;
using System.Security.Cryptography;
using Lookup.Catalogue;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Store;

namespace Lookup.Bench;

/// <summary>
/// <c>lookup ingest</c> against its stage bound, and its peak memory.
/// Speed: for generated 2 MP (1600 × 1200) and 12 MP (4000 × 3000) camera-like JPEGs (<see cref="SyntheticPhotos"/>),
/// every photo is first taken through each step of a worker on one thread — read + SHA-256, decode + resize to the
/// tensor, dHash + grey thumbnail, inference — then the network alone is run on all cores (one shared session, a
/// thread per core, as the workers call it), then the real ingest entry point indexes the same folder into a fresh
/// index with the default workers. The bound of the ingest target is cores ÷ (decode + resize + inference); a second
/// bound also counts the read, hash, dHash and thumbnail a worker does, so "ingest ÷ all-work bound" says how
/// much the pipeline itself (threads, channel, writer) loses.
/// Memory: a child process ingests N small generated photos (640 × 480) into a fresh index and reports its peak
/// working set (VmHWM); 1,000 are drawn and the rest are byte copies (each still read, hashed, decoded, embedded,
/// stored and inserted into the graph), because drawing and encoding a photo costs about as much CPU as ingesting it. Options: --quick (fewer photos, one round, 1,000 photos for memory), --photos N (memory
/// set, default 10,000), --per-size N, --rounds N, --only speed|memory.
/// </summary>
internal static class IngestBench
{
    /// <summary>The target, 1.5 GB, in MiB (VmHWM is reported in KiB).</summary>
    private const double MemoryTargetMib = 1.5e9 / 1048576;

    public static int Run(string[] args)
    {
        bool quick = args.Contains("--quick");
        string only = Option(args, "--only") ?? "all";
        int perSize = IntOption(args, "--per-size") ?? (quick ? 16 : 48);
        int rounds = IntOption(args, "--rounds") ?? (quick ? 1 : 3);
        int memoryPhotos = IntOption(args, "--photos") ?? (quick ? 1_000 : 10_000);
        string root = Path.Combine(Path.GetTempPath(), "lookup-bench-ingest");
        Directory.CreateDirectory(root);
        Console.WriteLine($"ingest bench, {DateTime.UtcNow:yyyy-MM-dd HH:mm} UTC, {Environment.ProcessorCount} cores, load {Load()}; photos under {root}");
        if (only is "all" or "speed")
        {
            Speed(root, perSize, rounds);
        }

        if (only is "all" or "memory")
        {
            Memory(root, memoryPhotos);
        }

        return 0;
    }

    /// <summary>The child of the memory run: <c>ingest-memory-child ROOT INDEX</c>.</summary>
    public static int MemoryChild(string[] args)
    {
        string root = args[1], indexPath = args[2];
        using var embedder = ImageEmbedder.Load(ModelCard.Default);
        using var file = IndexFile.Open(indexPath, IndexAccess.Write);
        int lastTenth = -1;
        var progress = new Inline(p =>
        {
            int tenth = p.Total == 0 ? 0 : p.Done * 10 / p.Total;
            if (p.Stage == "embedding" && tenth != lastTenth)
            {
                lastTenth = tenth;
                Console.Error.WriteLine($"  {p.Done:N0} / {p.Total:N0} photos, working set {Status("VmRSS")} MiB, peak {Status("VmHWM")} MiB, load {Load()}");
            }
        });
        var summary = new CatalogueIngest(file, embedder).Run(new IngestOptions { Root = root }, progress);
        Console.WriteLine(Invariant($"embedded {summary.Embedded} failed {summary.Failed} seconds {summary.Elapsed.TotalSeconds:0.0} rate {summary.PhotosPerSecond:0.0} peak-mib {Status("VmHWM")} gc-heap-mib {GC.GetGCMemoryInfo().HeapSizeBytes / 1048576.0:0}"));
        return summary.Embedded > 0 && summary.Failed == 0 ? 0 : 1;
    }

    private static void Speed(string root, int perSize, int rounds)
    {
        (string Label, int Width, int Height)[] sizes = [("2 MP", 1600, 1200), ("12 MP", 4000, 3000)];
        var sets = sizes.Select(s => (s.Label, Files: SyntheticPhotos.Ensure(
            Path.Combine(root, $"{s.Width}x{s.Height}-{perSize}"), s.Width, s.Height, perSize, perSku: 3, quality: 90, seed: 1000 * s.Width)))
            .ToList();
        foreach (var (label, files) in sets)
        {
            Console.WriteLine(Invariant($"{label}: {files.Length} JPEGs at quality 90, mean {files.Average(f => new FileInfo(f).Length) / 1e6:0.00} MB"));
        }

        using var embedder = ImageEmbedder.Load(ModelCard.Default);
        var decoder = new PhotoDecoder();
        WarmUp(root, embedder);
        var cpuRows = new List<string>();
        Console.WriteLine();
        Console.WriteLine("Wall time: single-thread ms per photo (mean) and rates in photos/s. Bound = cores ÷ (decode + resize + inference), the ingest target's; all-work bound also counts read + SHA-256 and dHash + thumbnail. Bare workers: one thread per core doing every worker step on its share of the photos, with no channel, writer or index.");
        Console.WriteLine();
        Console.WriteLine("| photo | round | load | read + hash | decode + resize | dHash + thumbnail | inference | bound | all-work bound | inference only | bare workers | ingest | ingest ÷ bound | ingest ÷ all-work bound |");
        Console.WriteLine("| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |");
        for (int round = 1; round <= rounds; round++)
        {
            foreach (var (label, files) in sets)
            {
                string load = Load();
                var (wall, cpu) = SingleThread(files, decoder, embedder);
                double cores = Environment.ProcessorCount;
                double bound = cores * 1000 / (wall.DecodeResize + wall.Inference);
                double allWork = cores * 1000 / wall.Sum;
                double inferenceOnly = InferenceOnly(embedder, files.Length);
                var bare = BareWorkers(files, decoder, embedder);
                var ingest = Ingest(Path.GetDirectoryName(Path.GetDirectoryName(files[0]))!, root, embedder, files.Length);
                Console.WriteLine(Invariant(
                    $"| {label} | {round} | {load} | {wall.ReadHash:0.0} | {wall.DecodeResize:0.0} | {wall.HashThumbnail:0.0} | {wall.Inference:0.0} | {bound:0.0} | {allWork:0.0} | {inferenceOnly:0.0} | {bare.Rate:0.0} | {ingest.Rate:0.0} | {ingest.Rate / bound:0.00} | {ingest.Rate / allWork:0.00} |"));
                double perPhoto = ingest.CpuMs / files.Length;
                cpuRows.Add(Invariant(
                    $"| {label} | {round} | {cpu.ReadHash:0.0} | {cpu.DecodeResize:0.0} | {cpu.HashThumbnail:0.0} | {cpu.Inference:0.0} | {bare.CpuMs / files.Length:0.0} | {perPhoto:0.0} | {(cpu.DecodeResize + cpu.Inference) / perPhoto:0.00} | {cpu.Sum / perPhoto:0.00} | {ingest.CpuMs / ingest.WallMs:0.00} |"));
            }
        }

        Console.WriteLine();
        Console.WriteLine("CPU time (less sensitive to other work on the machine): single-thread CPU ms per photo of each step, and the real ingest's process CPU ms per photo (all threads: workers, writer, scan, plan). Share = those steps' CPU ÷ the ingest's CPU per photo; an idle machine would give ingest ≈ cores × share ÷ (decode + resize + inference) if the workers kept every core busy. Cores used = ingest CPU time ÷ its wall time.");
        Console.WriteLine();
        Console.WriteLine("| photo | round | read + hash | decode + resize | dHash + thumbnail | inference | bare workers CPU per photo | ingest CPU per photo | share: decode + resize + inference | share: all worker steps | cores used |");
        Console.WriteLine("| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |");
        cpuRows.ForEach(Console.WriteLine);
    }

    /// <summary>One pass of everything a worker does to each photo, each step timed on this thread alone: mean wall
    /// and thread CPU milliseconds per photo.</summary>
    private static (Steps Wall, Steps Cpu) SingleThread(string[] files, PhotoDecoder decoder, ImageEmbedder embedder)
    {
        var tensor = new float[embedder.TensorLength];
        var embedding = new float[embedder.Dimension];
        var wall = new double[4];
        var cpu = new double[4];
        foreach (var path in files)
        {
            var marks = new (long Wall, double Cpu)[5];
            marks[0] = Mark();
            byte[] bytes = File.ReadAllBytes(path);
            _ = SHA256.HashData(bytes);
            marks[1] = Mark();
            using var photo = decoder.Decode(bytes, path);
            TensorWriter.WriteTensor(photo.Image, embedder.Normalisation, tensor);
            marks[2] = Mark();
            _ = DifferenceHash.Compute(photo.Image);
            _ = PhotoThumbnail.Of(photo.Image);
            marks[3] = Mark();
            embedder.Embed(tensor, embedding);
            marks[4] = Mark();
            for (int s = 0; s < 4; s++)
            {
                wall[s] += Stopwatch.GetElapsedTime(marks[s].Wall, marks[s + 1].Wall).TotalMilliseconds;
                cpu[s] += marks[s + 1].Cpu - marks[s].Cpu;
            }
        }

        int n = files.Length;
        return (new Steps(wall[0] / n, wall[1] / n, wall[2] / n, wall[3] / n), new Steps(cpu[0] / n, cpu[1] / n, cpu[2] / n, cpu[3] / n));
    }

    private static (long Wall, double Cpu) Mark() => (Stopwatch.GetTimestamp(), CpuClock.ThreadMs());

    /// <summary>Every worker step on one thread per core, each thread taking the next photo, with no channel, writer
    /// or index: what the ingest would reach if the pipeline around the workers cost nothing.</summary>
    private static (double Rate, double CpuMs) BareWorkers(string[] files, PhotoDecoder decoder, ImageEmbedder embedder)
    {
        int next = -1;
        var threads = Enumerable.Range(0, Environment.ProcessorCount).Select(worker => new Thread(() =>
        {
            var embedding = new float[embedder.Dimension];
            int i;
            while ((i = Interlocked.Increment(ref next)) < files.Length)
            {
                byte[] bytes = File.ReadAllBytes(files[i]);
                _ = SHA256.HashData(bytes);
                using var photo = decoder.Decode(bytes, files[i]);
                _ = DifferenceHash.Compute(photo.Image);
                _ = PhotoThumbnail.Of(photo.Image);
                embedder.Embed(photo.Image, embedding);
            }
        })).ToList();
        double cpu = CpuClock.ProcessMs();
        var clock = Stopwatch.StartNew();
        threads.ForEach(t => t.Start());
        threads.ForEach(t => t.Join());
        return (files.Length / clock.Elapsed.TotalSeconds, CpuClock.ProcessMs() - cpu);
    }

    /// <summary>Photos per second of the network alone: one thread per core on the one shared session.</summary>
    private static double InferenceOnly(ImageEmbedder embedder, int photos)
    {
        int perThread = Math.Max(photos, 24);
        var tensor = new float[embedder.TensorLength];
        var threads = Enumerable.Range(0, Environment.ProcessorCount).Select(_ => new Thread(() =>
        {
            var embedding = new float[embedder.Dimension];
            for (int i = 0; i < perThread; i++)
            {
                embedder.Embed(tensor, embedding);
            }
        })).ToList();
        var clock = Stopwatch.StartNew();
        threads.ForEach(t => t.Start());
        threads.ForEach(t => t.Join());
        return threads.Count * perThread / clock.Elapsed.TotalSeconds;
    }

    /// <summary>The real ingest (default workers, batch and channel) of <paramref name="tree"/> into a fresh index:
    /// the rate over the embedding phase, as the ingest summary reports it, and the process's CPU and wall time for the run.</summary>
    private static (double Rate, double CpuMs, double WallMs) Ingest(string tree, string root, ImageEmbedder embedder, int expected)
    {
        string path = Fresh(Path.Combine(root, "speed.lookup"));
        IngestSummary summary;
        double cpu = CpuClock.ProcessMs();
        using (var file = IndexFile.Open(path, IndexAccess.Write))
        {
            summary = new CatalogueIngest(file, embedder).Run(new IngestOptions { Root = tree });
        }

        cpu = CpuClock.ProcessMs() - cpu;
        if (summary.Embedded != expected || summary.Failed != 0)
        {
            throw new InvalidOperationException($"{tree}: ingest embedded {summary.Embedded} of {expected} photos ({summary.Failed} failed); delete {root} and run again.");
        }

        Fresh(path);
        return (summary.PhotosPerSecond, cpu, summary.Elapsed.TotalMilliseconds);
    }

    /// <summary>A small ingest first, so the timed ingests do not pay for JIT compilation and the first index file.</summary>
    private static void WarmUp(string root, ImageEmbedder embedder)
    {
        var files = SyntheticPhotos.Ensure(Path.Combine(root, "warm-up"), 640, 480, 8, perSku: 4, quality: 85, seed: 1);
        Ingest(Path.Combine(root, "warm-up"), root, embedder, files.Length);
    }

    private static void Memory(string root, int photos)
    {
        string tree = Path.Combine(root, $"640x480-{photos}");
        var clock = Stopwatch.StartNew();
        var files = SyntheticPhotos.Ensure(tree, 640, 480, photos, perSku: 4, quality: 85, seed: 7, distinct: 1_000);
        Console.WriteLine();
        Console.WriteLine(Invariant($"memory: {files.Length:N0} JPEGs of 640 × 480 ({Math.Min(photos, 1_000):N0} drawn, the rest byte copies of them, each still read, decoded, embedded and stored; mean {files.Take(200).Average(f => new FileInfo(f).Length) / 1e3:0} KB) ready in {clock.Elapsed.TotalSeconds:0} s; ingesting in a child process (default workers), load {Load()}"));
        string index = Fresh(Path.Combine(root, "memory.lookup"));
        var info = SelfStart();
        info.ArgumentList.Add("ingest-memory-child");
        info.ArgumentList.Add(tree);
        info.ArgumentList.Add(index);
        info.RedirectStandardOutput = true;
        using var child = Process.Start(info)!;
        string result = child.StandardOutput.ReadToEnd();
        child.WaitForExit();
        Fresh(index);
        var fields = result.Split(' ', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
        string Field(string name) => fields[Array.IndexOf(fields, name) + 1];
        if (child.ExitCode != 0 || !fields.Contains("peak-mib"))
        {
            throw new InvalidOperationException($"the memory child exited with {child.ExitCode}: {result}");
        }

        double peak = double.Parse(Field("peak-mib"), CultureInfo.InvariantCulture);
        Console.WriteLine();
        Console.WriteLine("| photos | embedded | wall s | photos/s | peak working set MiB | GC heap at end MiB | target | load after |");
        Console.WriteLine("| ---: | ---: | ---: | ---: | ---: | ---: | --- | ---: |");
        Console.WriteLine(Invariant(
            $"| {files.Length:N0} | {Field("embedded")} | {Field("seconds")} | {Field("rate")} | {peak:N0} | {Field("gc-heap-mib")} | ≤ 1.5 GB ({MemoryTargetMib:N0} MiB): {(peak <= MemoryTargetMib ? "met" : "MISSED")} | {Load()} |"));
    }

    private static ProcessStartInfo SelfStart()
    {
        string self = Environment.GetCommandLineArgs()[0];
        bool dll = self.EndsWith(".dll", StringComparison.Ordinal);
        var info = new ProcessStartInfo { FileName = dll ? "dotnet" : self, UseShellExecute = false };
        if (dll)
        {
            info.ArgumentList.Add(self);
        }

        return info;
    }

    /// <summary>A field of /proc/self/status in MiB (VmHWM: peak resident set; VmRSS: now).</summary>
    private static string Status(string field)
    {
        string line = File.ReadLines("/proc/self/status").First(l => l.StartsWith(field + ":", StringComparison.Ordinal));
        long kb = long.Parse(line.Split(' ', StringSplitOptions.RemoveEmptyEntries)[1], CultureInfo.InvariantCulture);
        return Invariant($"{kb / 1024.0:0}");
    }

    private static string Fresh(string path)
    {
        foreach (var stale in new[] { path, IndexFile.JournalPathFor(path), path + ".lock", path + ".readers" })
        {
            File.Delete(stale);
        }

        return path;
    }

    private static double Ms(long from, long to) => Stopwatch.GetElapsedTime(from, to).TotalMilliseconds;

    private static string? Option(string[] args, string name)
    {
        int at = Array.IndexOf(args, name);
        return at >= 0 && at + 1 < args.Length ? args[at + 1] : null;
    }

    private static int? IntOption(string[] args, string name) =>
        Option(args, name) is string value ? int.Parse(value, CultureInfo.InvariantCulture) : null;

    private static string Load() => File.ReadAllText("/proc/loadavg").Split(' ')[0];

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);

    private readonly record struct Steps(double ReadHash, double DecodeResize, double HashThumbnail, double Inference)
    {
        public double Sum => ReadHash + DecodeResize + HashThumbnail + Inference;
    }

    private sealed class Inline(Action<IngestProgress> report) : IProgress<IngestProgress>
    {
        public void Report(IngestProgress value) => report(value);
    }
}

#:project ../src/Lookup/Lookup.csproj
// Imaging and embedding benchmark: decode + resize of generated 2 MP and 12 MP JPEGs and single-thread inference.
// Run through tools/bench-imaging.sh. Everything runs on one thread (ImageSharp parallelism 1, ONNX intra-op 1),
// as one ingest worker does; the last line measures two workers sharing one session.
using System.Diagnostics;
using System.Globalization;
using Lookup.Embedding;
using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

var iterations = args.Length > 0 ? int.Parse(args[0], CultureInfo.InvariantCulture) : 20;
var source = args.Length > 1 ? args[1] : Path.Combine("tests", "reference-data", "skimage", "coffee.png");
var decoder = new PhotoDecoder();
using var embedder = ImageEmbedder.Load(ModelCard.Default);
var tensor = new float[embedder.TensorLength];
var embedding = new float[embedder.Dimension];
Console.WriteLine($"source {source}, {iterations} timed runs after 3 warm-up runs, single thread; load average {File.ReadAllText("/proc/loadavg").Split(' ')[0]}");
Console.WriteLine("photo      step                     median ms   mean ms    min ms");

foreach (var (label, width, height) in new[] { ("2 MP", 1732, 1155), ("12 MP", 4243, 2828) })
{
    // Upscaled from a reference photo, given fixed-seed grain so the JPEG is as busy as a camera's (an upscaled
    // photo alone compresses to a fraction of a real file), and saved as a camera would (quality 90, 4:2:0).
    using var original = Image.Load<Rgb24>(source);
    original.Mutate(x => x.Resize(width, height));
    AddGrain(original, seed: 12345);
    using var encoded = new MemoryStream();
    original.Save(encoded, new JpegEncoder { Quality = 90 });
    var bytes = encoded.ToArray();

    Report(label, $"decode ({bytes.Length / 1e6:0.0} MB JPEG)", () => decoder.Decode(bytes, label).Dispose());
    using var photo = decoder.Decode(bytes, label);
    Report(label, "resize + crop to tensor", () => TensorWriter.WriteTensor(photo.Image, embedder.Normalisation, tensor));
    Report(label, "decode + resize", () =>
    {
        using var p = decoder.Decode(bytes, label);
        TensorWriter.WriteTensor(p.Image, embedder.Normalisation, tensor);
    });
    Report(label, "dHash", () => DifferenceHash.Compute(photo.Image));
}

Report("224 px", "inference (1 thread)", () => embedder.Embed(tensor, embedding));

// Two workers sharing the one session, each with its own buffers, as ingest runs on 2 cores.
var perWorker = Math.Max(iterations, 20);
var clock = Stopwatch.StartNew();
Parallel.For(0, 2, new ParallelOptions { MaxDegreeOfParallelism = 2 }, _ =>
{
    var own = new float[embedder.Dimension];
    for (var i = 0; i < perWorker; i++)
    {
        embedder.Embed(tensor, own);
    }
});
Console.WriteLine($"224 px     inference, 2 workers         {2 * perWorker / clock.Elapsed.TotalSeconds,9:0.0} photos/s");

void Report(string label, string step, Action action)
{
    for (var i = 0; i < 3; i++)
    {
        action();
    }

    var times = new double[iterations];
    for (var i = 0; i < iterations; i++)
    {
        var start = Stopwatch.GetTimestamp();
        action();
        times[i] = Stopwatch.GetElapsedTime(start).TotalMilliseconds;
    }

    Array.Sort(times);
    Console.WriteLine($"{label,-10} {step,-24} {times[iterations / 2],9:0.0} {times.Average(),9:0.0} {times[0],9:0.0}");
}

static void AddGrain(Image<Rgb24> image, int seed)
{
    var random = new Random(seed);
    var noise = new sbyte[1 << 16];
    for (var i = 0; i < noise.Length; i++)
    {
        noise[i] = (sbyte)random.Next(-12, 13);
    }

    image.ProcessPixelRows(rows =>
    {
        var k = 0;
        for (var y = 0; y < rows.Height; y++)
        {
            foreach (ref var p in rows.GetRowSpan(y))
            {
                p = new Rgb24(Clamp(p.R + noise[k++ & 0xFFFF]), Clamp(p.G + noise[k++ & 0xFFFF]), Clamp(p.B + noise[k++ & 0xFFFF]));
            }

            k += 7919;
        }
    });
}

static byte Clamp(int value) => (byte)Math.Clamp(value, 0, 255);

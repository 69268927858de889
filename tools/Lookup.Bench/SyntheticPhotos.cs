using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Bench;

/// <summary>
/// Seeded photo-like JPEGs for the ingest benchmark: a two-colour gradient, a wood-grain-like ripple, a dozen
/// shaded ellipses and boxes (the "parts"), and per-pixel sensor grain, saved at quality 90 as a camera would. The
/// grain and the edges make the files about as large as a camera's (a flat synthetic image compresses to a
/// fraction of a real file, and JPEG decode time grows with the coded data).
/// </summary>
internal static class SyntheticPhotos
{
    /// <summary>Writes <paramref name="count"/> photos of <paramref name="width"/> × <paramref name="height"/> under
    /// <paramref name="root"/>, <paramref name="perSku"/> per SKU folder, unless a previous run completed the same set.
    /// Only the first <paramref name="distinct"/> are drawn; photo i after them is a byte copy of photo i mod
    /// <paramref name="distinct"/> (drawing and encoding cost about as much CPU as ingesting).</summary>
    /// <returns>The photo files, in path order.</returns>
    public static string[] Ensure(string root, int width, int height, int count, int perSku, int quality, int seed, int? distinct = null)
    {
        int drawn = Math.Min(count, distinct ?? count);
        string marker = Path.Combine(root, "complete.txt");
        string stamp = $"v1 {width}x{height} {count} ({drawn} drawn) {perSku} q{quality} seed {seed}";
        if (!File.Exists(marker) || File.ReadAllText(marker) != stamp)
        {
            if (Directory.Exists(root))
            {
                Directory.Delete(root, recursive: true);
            }

            string PathOf(int i) => Path.Combine(root, $"SKU-{i / perSku:D5}", $"photo-{i:D5}.jpg");
            Parallel.For(0, count, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, i =>
            {
                Directory.CreateDirectory(Path.GetDirectoryName(PathOf(i))!);
                if (i < drawn)
                {
                    File.WriteAllBytes(PathOf(i), Jpeg(width, height, quality, seed + i));
                }
            });
            for (int i = drawn; i < count; i++)
            {
                File.Copy(PathOf(i % drawn), PathOf(i));
            }

            File.WriteAllText(marker, stamp);
        }

        return [.. Directory.GetFiles(root, "*.jpg", SearchOption.AllDirectories).Order(StringComparer.Ordinal)];
    }

    /// <summary>One photo as JPEG bytes.</summary>
    public static byte[] Jpeg(int width, int height, int quality, int seed)
    {
        using var image = new Image<Rgb24>(width, height);
        var random = new Random(seed);
        Background(image, random);
        for (int s = 0; s < 12; s++)
        {
            Shape(image, random);
        }

        Grain(image, (uint)seed * 2654435761u | 1u);
        using var stream = new MemoryStream();
        image.SaveAsJpeg(stream, new JpegEncoder { Quality = quality });
        return stream.ToArray();
    }

    private static void Background(Image<Rgb24> image, Random random)
    {
        var (a, b) = (RandomColour(random), RandomColour(random));
        float frequency = (float)(0.02 + (random.NextDouble() * 0.05)) * 640f / image.Width;
        float wobble = (float)(random.NextDouble() * 6);
        image.ProcessPixelRows(rows =>
        {
            for (int y = 0; y < rows.Height; y++)
            {
                var row = rows.GetRowSpan(y);
                for (int x = 0; x < row.Length; x++)
                {
                    float t = ((float)x / row.Length * 0.6f) + ((float)y / rows.Height * 0.4f);
                    float ripple = 18f * MathF.Sin((x * frequency) + (wobble * MathF.Sin(y * frequency * 0.3f)));
                    row[x] = Mix(a, b, t, ripple);
                }
            }
        });
    }

    private static void Shape(Image<Rgb24> image, Random random)
    {
        int w = image.Width, h = image.Height;
        float rx = (float)(0.03 + (random.NextDouble() * 0.15)) * w;
        float ry = (float)(0.03 + (random.NextDouble() * 0.15)) * h;
        float cx = (float)random.NextDouble() * w, cy = (float)random.NextDouble() * h;
        bool box = random.Next(2) == 0;
        var (lit, dark) = (RandomColour(random), RandomColour(random));
        int x0 = Math.Max(0, (int)(cx - rx)), x1 = Math.Min(w - 1, (int)(cx + rx));
        int y0 = Math.Max(0, (int)(cy - ry)), y1 = Math.Min(h - 1, (int)(cy + ry));
        image.ProcessPixelRows(rows =>
        {
            for (int y = y0; y <= y1; y++)
            {
                var row = rows.GetRowSpan(y);
                float dy = (y - cy) / ry;
                for (int x = x0; x <= x1; x++)
                {
                    float dx = (x - cx) / rx;
                    float r2 = (dx * dx) + (dy * dy);
                    if (box || r2 <= 1f)
                    {
                        // Shaded as if lit from the upper left, so each shape has a highlight and a shadow side.
                        float t = Math.Clamp(0.5f + (0.35f * (dx + dy)) + (box ? 0f : 0.2f * r2), 0f, 1f);
                        row[x] = Mix(lit, dark, t, 0f);
                    }
                }
            }
        });
    }

    /// <summary>Adds ±12 grey levels of independent noise per channel (xorshift32, fast and seeded).</summary>
    private static void Grain(Image<Rgb24> image, uint state)
    {
        image.ProcessPixelRows(rows =>
        {
            for (int y = 0; y < rows.Height; y++)
            {
                foreach (ref var p in rows.GetRowSpan(y))
                {
                    state ^= state << 13;
                    state ^= state >> 17;
                    state ^= state << 5;
                    p = new Rgb24(Add(p.R, state), Add(p.G, state >> 8), Add(p.B, state >> 16));
                }
            }
        });
    }

    private static byte Add(byte value, uint bits) => (byte)Math.Clamp(value + (int)(bits % 25) - 12, 0, 255);

    private static Rgb24 RandomColour(Random random) => new((byte)random.Next(256), (byte)random.Next(256), (byte)random.Next(256));

    private static Rgb24 Mix(Rgb24 a, Rgb24 b, float t, float offset) => new(
        Channel(a.R, b.R, t, offset), Channel(a.G, b.G, t, offset), Channel(a.B, b.B, t, offset));

    private static byte Channel(byte a, byte b, float t, float offset) => (byte)Math.Clamp(a + ((b - a) * t) + offset, 0f, 255f);
}

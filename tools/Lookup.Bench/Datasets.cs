using System.Diagnostics;
using Lookup.Graph;
using Lookup.Tests.Datasets;

namespace Lookup.Bench;

/// <summary>
/// The bench's vectors: embeddings from the product's default embedder (ResNet18) of Fashion-MNIST images (Debian dataset-fashion-mnist; Xiao, Rasul
/// &amp; Vollgraf 2017), computed once and cached under tools/bench/cache/ (git-ignored), and noisy copies of them.
/// </summary>
internal static class Datasets
{
    public static string RepoRoot
    {
        get
        {
            for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            {
                if (File.Exists(Path.Combine(dir.FullName, "Lookup.sln")))
                {
                    return dir.FullName;
                }
            }

            return Directory.GetCurrentDirectory();
        }
    }

    public static string CacheDirectory => Path.Combine(RepoRoot, "tools", "bench", "cache");

    /// <summary>The first <paramref name="count"/> images of a split ("train" or "t10k"), embedded (unit length), from the cache when it holds enough.</summary>
    public static float[][] Real(string split, int count)
    {
        var cached = Directory.Exists(CacheDirectory)
            ? Directory.GetFiles(CacheDirectory, $"fashion-mnist-{split}-embedder-*.f32")
                .Select(path => (path, rows: int.Parse(Path.GetFileNameWithoutExtension(path).Split('-')[^1], System.Globalization.CultureInfo.InvariantCulture)))
                .Where(c => c.rows >= count)
                .OrderBy(c => c.rows)
                .FirstOrDefault()
            : default;
        if (cached.path is not null)
        {
            return [.. EmbeddingCache.TryLoad(cached.path)!.Take(count)];
        }

        var images = FashionMnist.ReadImages(Path.Combine(FashionMnist.DebianDirectory, $"{split}-images-idx3-ubyte.gz"), count);
        Console.Error.WriteLine($"embedding {images.Length} {split} images with ResNet18 on {Environment.ProcessorCount} threads (cached afterwards) ...");
        var watch = Stopwatch.StartNew();
        var vectors = FashionMnistEmbedder.EmbedAll(images, Environment.ProcessorCount);
        Console.Error.WriteLine($"  {images.Length / watch.Elapsed.TotalSeconds:F1} images/s");

        EmbeddingCache.Save(Path.Combine(CacheDirectory, $"fashion-mnist-{split}-embedder-{count}.f32"), vectors);
        return vectors;
    }

    /// <summary><paramref name="total"/> vectors: real ones in turn plus N(0, σ²) per component, renormalised.</summary>
    public static float[][] Noisy(float[][] real, int total, double sigma, int seed)
    {
        var random = new Random(seed);
        var result = new float[total][];
        for (int i = 0; i < total; i++)
        {
            var source = real[i % real.Length];
            var v = new float[source.Length];
            for (int j = 0; j < v.Length; j++)
            {
                double u1 = 1.0 - random.NextDouble();
                double u2 = random.NextDouble();
                v[j] = source[j] + (float)(sigma * Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2));
            }

            CosineKernel.Normalize(v, v);
            result[i] = v;
        }

        return result;
    }
}

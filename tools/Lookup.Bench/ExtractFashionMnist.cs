using Lookup.Tests.Datasets;

namespace Lookup.Bench;

/// <summary>
/// `extract-fashion-mnist`: copies the first N test images and labels of the Debian package
/// dataset-fashion-mnist into tests/reference-data/fashion-mnist/ (idx format, gzip), for tests that must
/// run where the package is not installed, with their embeddings from the product's default embedder (tests
/// re-embed a sample to check the committed file still matches).
/// </summary>
internal static class ExtractFashionMnist
{
    public static int Run(string[] args)
    {
        int at = Array.IndexOf(args, "--count");
        int count = at >= 0 ? int.Parse(args[at + 1], System.Globalization.CultureInfo.InvariantCulture) : 2000;
        string source = FashionMnist.DebianDirectory;
        var images = FashionMnist.ReadImages(Path.Combine(source, "t10k-images-idx3-ubyte.gz"), count);
        var labels = FashionMnist.ReadLabels(Path.Combine(source, "t10k-labels-idx1-ubyte.gz"), count);
        string target = Path.Combine(Datasets.RepoRoot, "tests", "reference-data", "fashion-mnist");
        Directory.CreateDirectory(target);
        FashionMnist.WriteSubset(
            Path.Combine(target, $"t10k-first{count}-images-idx3-ubyte.gz"),
            Path.Combine(target, $"t10k-first{count}-labels-idx1-ubyte.gz"),
            images,
            labels);
        Console.WriteLine($"wrote {count} images and labels to {target}; embedding them ...");
        var vectors = FashionMnistEmbedder.EmbedAll(images, Environment.ProcessorCount);

        EmbeddingCache.SaveHalf(Path.Combine(target, $"t10k-first{count}-resnet18-f16.bin.gz"), vectors);
        Console.WriteLine("wrote their unit-length embeddings from the default ResNet18 embedder (float16)");
        return 0;
    }
}

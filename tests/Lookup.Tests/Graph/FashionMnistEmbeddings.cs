using Lookup.Tests.Datasets;

namespace Lookup.Tests.Graph;

/// <summary>
/// Shared, loaded once per test run: 2,000 Fashion-MNIST test images (Xiao, Rasul &amp; Vollgraf 2017; Debian
/// dataset-fashion-mnist; MIT), their labels and their committed ResNet18 embeddings (see tests/reference-data/SOURCES.md).
/// </summary>
public sealed class FashionMnistEmbeddings
{
    public FashionMnistEmbeddings()
    {
        Images = FashionMnist.ReadImages(ReferencePaths.FashionMnist("t10k-first2000-images-idx3-ubyte.gz"));
        Labels = FashionMnist.ReadLabels(ReferencePaths.FashionMnist("t10k-first2000-labels-idx1-ubyte.gz"));
        Vectors = EmbeddingCache.LoadHalf(ReferencePaths.FashionMnist("t10k-first2000-resnet18-f16.bin.gz"));
    }

    public byte[][] Images { get; }

    public byte[] Labels { get; }

    public float[][] Vectors { get; }
}

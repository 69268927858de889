using Lookup.Embedding;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Datasets;

/// <summary>
/// Embeds 28×28 grey Fashion-MNIST images with the product's default embedder (ResNet18 through
/// <see cref="ImageEmbedder"/>): the grey value goes to R, G and B alike and the embedder does its usual resize
/// to 224×224, so the graph tests and the bench use exactly the vectors ingest would make. Thread-safe, like
/// <see cref="ImageEmbedder"/>.
/// </summary>
internal sealed class FashionMnistEmbedder : IDisposable
{
    public const int Dimension = 512;

    private readonly ImageEmbedder _embedder = ImageEmbedder.Load(ModelCard.Default);

    /// <summary>The unit-length embedding of one image.</summary>
    public float[] Embed(byte[] grey)
    {
        using var image = new Image<Rgb24>(FashionMnist.Side, FashionMnist.Side);
        for (int y = 0; y < FashionMnist.Side; y++)
        {
            for (int x = 0; x < FashionMnist.Side; x++)
            {
                byte v = grey[(y * FashionMnist.Side) + x];
                image[x, y] = new Rgb24(v, v, v);
            }
        }

        var embedding = new float[_embedder.Dimension];
        _embedder.Embed(image, embedding);
        return embedding;
    }

    /// <summary>Embeds every image on <paramref name="threads"/> threads sharing one session.</summary>
    public static float[][] EmbedAll(IReadOnlyList<byte[]> images, int threads)
    {
        using var embedder = new FashionMnistEmbedder();
        var result = new float[images.Count][];
        Parallel.For(0, images.Count, new ParallelOptions { MaxDegreeOfParallelism = threads }, i => result[i] = embedder.Embed(images[i]));
        return result;
    }

    public void Dispose() => _embedder.Dispose();
}

using System.Collections.Concurrent;
using Lookup.Embedding;
using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Embedding;

/// <summary>
/// One real default embedder (ResNet18 from the build output) shared by every embedding test class, with a cache of
/// file embeddings, so the model is loaded once and each reference photo embedded once per test run.
/// </summary>
public sealed class EmbedderFixture : IDisposable
{
    private readonly ConcurrentDictionary<string, float[]> files = new(StringComparer.Ordinal);

    public EmbedderFixture()
    {
        Decoder = new PhotoDecoder();
        Embedder = ImageEmbedder.Load(ModelCard.Default);
        Photos = new PhotoEmbedder(Decoder, Embedder);
    }

    public PhotoDecoder Decoder { get; }

    public ImageEmbedder Embedder { get; }

    public PhotoEmbedder Photos { get; }

    public float[] EmbedFile(string path) => files.GetOrAdd(path, p =>
    {
        var embedding = new float[Embedder.Dimension];
        Photos.Embed(p, embedding);
        return embedding;
    });

    public float[] EmbedBytes(byte[] content, string name)
    {
        var embedding = new float[Embedder.Dimension];
        Photos.Embed(content, name, embedding);
        return embedding;
    }

    public float[] EmbedImage(Image<Rgb24> image)
    {
        var embedding = new float[Embedder.Dimension];
        Embedder.Embed(image, embedding);
        return embedding;
    }

    public void Dispose() => Embedder.Dispose();
}

using System.Buffers;
using System.Diagnostics;
using Lookup.Imaging;
using SixLabors.ImageSharp;

namespace Lookup.Embedding;

/// <summary>
/// File → decode (limits) → tensor → embedding, for one photo at a time per caller. Thread-safe: it holds only the
/// thread-safe decoder and embedder, which the caller owns and disposes.
/// </summary>
public sealed class PhotoEmbedder(PhotoDecoder decoder, ImageEmbedder embedder)
{
    /// <summary>The decoder used for files.</summary>
    public PhotoDecoder Decoder { get; } = decoder ?? throw new ArgumentNullException(nameof(decoder));

    /// <summary>The network used for embeddings.</summary>
    public ImageEmbedder Embedder { get; } = embedder ?? throw new ArgumentNullException(nameof(embedder));

    /// <summary>Embeds the photo at <paramref name="path"/> into <paramref name="embedding"/>.</summary>
    /// <exception cref="PhotoRejectedException">The file cannot be used; the message says why.</exception>
    public PhotoEmbedding Embed(string path, Span<float> embedding)
    {
        var start = Stopwatch.GetTimestamp();
        using var photo = Decoder.Decode(path);
        return Embed(photo, Stopwatch.GetElapsedTime(start), embedding);
    }

    /// <summary>Embeds a photo whose bytes the caller already holds; <paramref name="path"/> is for messages.</summary>
    /// <exception cref="PhotoRejectedException">The bytes cannot be used; the message says why.</exception>
    public PhotoEmbedding Embed(ReadOnlyMemory<byte> content, string path, Span<float> embedding)
    {
        var start = Stopwatch.GetTimestamp();
        using var photo = Decoder.Decode(content, path);
        return Embed(photo, Stopwatch.GetElapsedTime(start), embedding);
    }

    /// <summary>Embeds <paramref name="region"/> of an already decoded photo (for example one crop of several).</summary>
    /// <returns>The L2 norm before normalisation.</returns>
    public float Embed(DecodedPhoto photo, Rectangle region, Span<float> embedding)
    {
        ArgumentNullException.ThrowIfNull(photo);
        return Embedder.Embed(photo.Image, region, embedding);
    }

    private PhotoEmbedding Embed(DecodedPhoto photo, TimeSpan decodeTime, Span<float> embedding)
    {
        var length = Embedder.TensorLength;
        var tensor = ArrayPool<float>.Shared.Rent(length);
        try
        {
            var start = Stopwatch.GetTimestamp();
            var hash = DifferenceHash.Compute(photo.Image);
            TensorWriter.WriteTensor(photo.Image, Embedder.Normalisation, tensor.AsSpan(0, length));
            var prepared = Stopwatch.GetTimestamp();
            var norm = Embedder.Embed(tensor.AsSpan(0, length), embedding);
            var inferenceTime = Stopwatch.GetElapsedTime(prepared);
            return new PhotoEmbedding(photo.Info, hash, norm, decodeTime, Stopwatch.GetElapsedTime(start, prepared), inferenceTime);
        }
        finally
        {
            ArrayPool<float>.Shared.Return(tensor);
        }
    }
}

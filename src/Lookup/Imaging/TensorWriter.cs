using System.Runtime.InteropServices;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Advanced;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;
using SixLabors.ImageSharp.Processing.Processors.Transforms;

namespace Lookup.Imaging;

/// <summary>
/// Resize so the shorter side equals the model size, centre-crop the square, and write a planar CHW float tensor.
/// Implemented as one resize of the centred square of the region, which is the same thing without the large
/// intermediate image. Resampling is bilinear with ImageSharp's area-aware kernel scaling when shrinking (common
/// practice for CNN input; it avoids aliasing on large photos).
/// </summary>
public static class TensorWriter
{
    private static readonly IResampler Resampler = KnownResamplers.Triangle;

    /// <summary>Writes the tensor for the whole of <paramref name="image"/>.</summary>
    public static void WriteTensor(Image<Rgb24> image, PixelNormalisation normalisation, Span<float> destination)
    {
        ArgumentNullException.ThrowIfNull(image);
        WriteTensor(image, new Rectangle(0, 0, image.Width, image.Height), normalisation, destination);
    }

    /// <summary>
    /// Writes the tensor for <paramref name="region"/> of <paramref name="image"/> into the first
    /// <see cref="PixelNormalisation.TensorLength"/> floats of <paramref name="destination"/>.
    /// </summary>
    public static void WriteTensor(Image<Rgb24> image, Rectangle region, PixelNormalisation normalisation, Span<float> destination)
    {
        ArgumentNullException.ThrowIfNull(image);
        ArgumentNullException.ThrowIfNull(normalisation);
        if (region.Width <= 0 || region.Height <= 0 || !image.Bounds().Contains(region))
        {
            throw new ArgumentOutOfRangeException(nameof(region), $"Region {region} must be non-empty and inside the {image.Width} × {image.Height} image.");
        }

        if (destination.Length < normalisation.TensorLength)
        {
            throw new ArgumentException($"The destination holds {destination.Length} floats; a {normalisation.Size} × {normalisation.Size} tensor needs {normalisation.TensorLength}.", nameof(destination));
        }

        var size = normalisation.Size;
        var square = CentreSquare(region);
        using var resized = image.Clone(x => x.Resize(size, size, Resampler, square, new Rectangle(0, 0, size, size), compand: false));
        for (var y = 0; y < size; y++)
        {
            WriteRow(resized.DangerousGetPixelRowMemory(y).Span, y, normalisation, destination);
        }
    }

    /// <summary>The largest square centred in <paramref name="region"/>: what survives a shorter-side resize and centre crop.</summary>
    public static Rectangle CentreSquare(Rectangle region)
    {
        var side = Math.Min(region.Width, region.Height);
        return new Rectangle(region.X + ((region.Width - side) / 2), region.Y + ((region.Height - side) / 2), side, side);
    }

    private static void WriteRow(ReadOnlySpan<Rgb24> row, int y, PixelNormalisation normalisation, Span<float> destination)
    {
        var size = normalisation.Size;
        var planeLength = size * size;
        var gain = normalisation.Gain;
        var offset = normalisation.Offset;
        var meanImage = normalisation.MeanImage;
        var bytes = MemoryMarshal.AsBytes(row);
        for (var plane = 0; plane < 3; plane++)
        {
            var source = normalisation.SourceChannel(plane);
            var start = (plane * planeLength) + (y * size);
            var output = destination.Slice(start, size);
            var g = gain[plane];
            var o = offset[plane];
            for (var x = 0; x < size; x++)
            {
                output[x] = (bytes[(3 * x) + source] * g) + o;
            }

            if (!meanImage.IsEmpty)
            {
                System.Numerics.Tensors.TensorPrimitives.Subtract(output, meanImage.Slice(start, size), output);
            }
        }
    }
}

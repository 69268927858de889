using System.Numerics.Tensors;

namespace Lookup.Sweeps;

/// <summary>
/// Normalised cross-correlation (NCC) of grey samples: the cosine between the two mean-removed sample vectors, so a
/// uniform change of brightness or contrast leaves it unchanged. 1 is the same picture, 0 unrelated.
/// </summary>
internal static class ThumbnailCorrelation
{
    /// <summary>
    /// Writes <paramref name="pixels"/> minus their mean, scaled to unit length, into <paramref name="target"/>.
    /// Returns false (and writes zeros) for a flat picture, which correlates with nothing.
    /// </summary>
    public static bool Standardise(ReadOnlySpan<float> pixels, Span<float> target)
    {
        var mean = TensorPrimitives.Sum(pixels) / pixels.Length;
        TensorPrimitives.Subtract(pixels, mean, target);
        var norm = TensorPrimitives.Norm(target);
        if (norm < 1e-3f * pixels.Length)
        {
            target.Clear();
            return false;
        }

        TensorPrimitives.Divide(target, norm, target);
        return true;
    }

    /// <summary>Grey bytes to floats.</summary>
    public static void ToFloats(ReadOnlySpan<byte> pixels, Span<float> target)
    {
        for (var i = 0; i < pixels.Length; i++)
        {
            target[i] = pixels[i];
        }
    }

    /// <summary>Reverses every row of a square picture of side <paramref name="side"/> (a left-right mirror).</summary>
    public static void MirrorRows(ReadOnlySpan<float> pixels, Span<float> target, int side)
    {
        for (var y = 0; y < side; y++)
        {
            var row = pixels.Slice(y * side, side);
            var mirrored = target.Slice(y * side, side);
            for (var x = 0; x < side; x++)
            {
                mirrored[side - 1 - x] = row[x];
            }
        }
    }

    /// <summary>
    /// Shrinks a 32 × 32 picture to <paramref name="side"/> × <paramref name="side"/> by area averaging, so it holds no
    /// more detail than a container region that spans <paramref name="side"/> thumbnail pixels.
    /// </summary>
    public static void Shrink(ReadOnlySpan<float> pixels, Span<float> target, int side, Span<float> scratch)
    {
        const int full = GreyThumbnail.Side;
        var weights = AreaWeights.For(full, side);
        var narrow = scratch[..(full * side)];
        for (var y = 0; y < full; y++)
        {
            weights.Apply(pixels.Slice(y * full, full), narrow.Slice(y * side, side));
        }

        Span<float> column = stackalloc float[full];
        Span<float> shrunk = stackalloc float[full];
        for (var x = 0; x < side; x++)
        {
            for (var y = 0; y < full; y++)
            {
                column[y] = narrow[(y * side) + x];
            }

            weights.Apply(column, shrunk[..side]);
            for (var y = 0; y < side; y++)
            {
                target[(y * side) + x] = shrunk[y];
            }
        }
    }

    /// <summary>Halves a square picture of side <paramref name="side"/> by 2 × 2 box averaging.</summary>
    public static void Halve(ReadOnlySpan<float> pixels, Span<float> target, int side)
    {
        var half = side / 2;
        for (var y = 0; y < half; y++)
        {
            for (var x = 0; x < half; x++)
            {
                var i = (2 * y * side) + (2 * x);
                target[(y * half) + x] = 0.25f * (pixels[i] + pixels[i + 1] + pixels[i + side] + pixels[i + side + 1]);
            }
        }
    }
}

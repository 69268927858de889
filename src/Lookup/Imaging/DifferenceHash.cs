using System.Numerics;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Imaging;

/// <summary>
/// 64-bit difference hash (dHash; N. Krawetz, "Kind of Like That", 2013): shrink to a 9 × 8 grey thumbnail and
/// set one bit per adjacent pair in each row where the right pixel is brighter than the left. Bit 63 is row 0,
/// pair 0; bits run row by row. Re-encodes and resizes change few bits; different photos differ in about half.
/// </summary>
public static class DifferenceHash
{
    private const int Columns = 9;
    private const int Rows = 8;

    /// <summary>Computes the hash of the whole image.</summary>
    public static ulong Compute(Image<Rgb24> image)
    {
        ArgumentNullException.ThrowIfNull(image);

        // Box filter: each thumbnail pixel is the average of its block, so every source pixel counts.
        using var thumbnail = image.Clone(x => x.Resize(Columns, Rows, KnownResamplers.Box));
        Span<float> grey = stackalloc float[Columns * Rows];
        for (var y = 0; y < Rows; y++)
        {
            for (var x = 0; x < Columns; x++)
            {
                var p = thumbnail[x, y];

                // ITU-R BT.601 luma weights (common practice for greyscale conversion).
                grey[(y * Columns) + x] = (0.299f * p.R) + (0.587f * p.G) + (0.114f * p.B);
            }
        }

        return FromGrey(grey);
    }

    /// <summary>Number of differing bits: 0 for the same picture, about 32 for unrelated ones.</summary>
    public static int Distance(ulong a, ulong b) => BitOperations.PopCount(a ^ b);

    /// <summary>The hash as 16 lower-case hex digits.</summary>
    public static string ToHex(ulong hash) => hash.ToString("x16", System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>The hash of a 9 × 8 grey thumbnail given row by row.</summary>
    internal static ulong FromGrey(ReadOnlySpan<float> grey)
    {
        var hash = 0UL;
        for (var y = 0; y < Rows; y++)
        {
            for (var x = 0; x < Columns - 1; x++)
            {
                hash <<= 1;
                if (grey[(y * Columns) + x + 1] > grey[(y * Columns) + x])
                {
                    hash |= 1;
                }
            }
        }

        return hash;
    }
}

using System.Buffers;
using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Catalogue;

/// <summary>
/// The sweep's 32 × 32 grey thumbnail (<see cref="GreyThumbnail"/>, an area average of the whole photo) taken at
/// ingest. A photo more than twice <see cref="SourceSide"/> on its longer side is first averaged over k × k blocks
/// (k = longer side ÷ <see cref="SourceSide"/>, rounded down) in one pass over its rows, so a 12 MP photo costs one
/// read of its pixels instead of a 12 MB grey copy (Lookup.Bench ingest: the copy cost as much as the inference).
/// </summary>
/// <remarks>
/// Averaging blocks first and then areas moves the bin edges by less than one block, and the grey level is taken from
/// the block's mean colour rather than averaged from each pixel's rounded grey: together a few grey levels at most
/// (PhotoWorkerTests measure it against the full-size area average through ImageSharp's grey conversion). Grey is
/// ITU-R BT.709 luma with the weights and rounding of ImageSharp's Rgb24 → L8 conversion, which smaller photos use.
/// Thread safety: stateless.
/// </remarks>
internal static class PhotoThumbnail
{
    /// <summary>Longest side kept before the area average (16 block means per thumbnail pixel at the least).</summary>
    public const int SourceSide = 512;

    /// <summary>The thumbnail of <paramref name="image"/>, 1,024 grey bytes row by row.</summary>
    public static byte[] Of(Image<Rgb24> image)
    {
        int k = Math.Min(
            Math.Max(image.Width, image.Height) / SourceSide,
            Math.Min(image.Width, image.Height) / GreyThumbnail.Side);
        return k < 2 ? FullSize(image) : BlockAveraged(image, k);
    }

    private static byte[] FullSize(Image<Rgb24> image)
    {
        using var grey = image.CloneAs<L8>();
        byte[] pixels = new byte[image.Width * image.Height];
        grey.CopyPixelDataTo(pixels);
        return GreyThumbnail.FromGrey(pixels, image.Width, image.Height).Pixels.ToArray();
    }

    private static byte[] BlockAveraged(Image<Rgb24> image, int k)
    {
        int width = (image.Width + k - 1) / k;
        int height = (image.Height + k - 1) / k;
        byte[] grey = ArrayPool<byte>.Shared.Rent(width * height);
        int[] sums = ArrayPool<int>.Shared.Rent(width * 3);
        try
        {
            image.ProcessPixelRows(rows =>
            {
                for (int by = 0; by < height; by++)
                {
                    Array.Clear(sums, 0, width * 3);
                    int rowCount = Math.Min(k, rows.Height - (by * k));
                    for (int r = 0; r < rowCount; r++)
                    {
                        AddRow(rows.GetRowSpan((by * k) + r), k, sums);
                    }

                    for (int bx = 0; bx < width; bx++)
                    {
                        float count = rowCount * Math.Min(k, rows.Width - (bx * k));
                        float red = sums[bx * 3] / count;
                        float green = sums[(bx * 3) + 1] / count;
                        float blue = sums[(bx * 3) + 2] / count;
                        grey[(by * width) + bx] = (byte)Math.Clamp((0.2126f * red) + (0.7152f * green) + (0.0722f * blue) + 0.5f, 0f, 255f);
                    }
                }
            });
            return GreyThumbnail.FromGrey(grey.AsSpan(0, width * height), width, height).Pixels.ToArray();
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(grey);
            ArrayPool<int>.Shared.Return(sums);
        }
    }

    /// <summary>Adds one row's red, green and blue into the per-block sums (block b covers columns b·k … b·k + k − 1).</summary>
    private static void AddRow(ReadOnlySpan<Rgb24> row, int k, int[] sums)
    {
        for (int start = 0, block = 0; start < row.Length; start += k, block += 3)
        {
            int red = 0, green = 0, blue = 0;
            foreach (var p in row.Slice(start, Math.Min(k, row.Length - start)))
            {
                red += p.R;
                green += p.G;
                blue += p.B;
            }

            sums[block] += red;
            sums[block + 1] += green;
            sums[block + 2] += blue;
        }
    }
}

using System.Buffers;
using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Catalogue;

/// <summary>
/// The sweep's pixel evidence taken at ingest: the 32 × 32 grey thumbnail (<see cref="GreyThumbnail"/>, an area
/// average of the whole photo), the 64 × 64 grey <see cref="DetailThumbnail"/> and the 32 × 32 <see cref="ChromaThumbnail"/>. A photo more than twice <see cref="SourceSide"/> on its longer side is first averaged over k × k blocks
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
    public static byte[] Of(Image<Rgb24> image) => EvidenceOf(image).Thumbnail;

    /// <summary>
    /// The 32 × 32 grey thumbnail, the 64 × 64 grey detail thumbnail and the 32 × 32 Cb and Cr planes of
    /// <paramref name="image"/>, from one pass over its pixels (block means first for a large photo, as above).
    /// </summary>
    public static PhotoPixelEvidence EvidenceOf(Image<Rgb24> image)
    {
        int k = Math.Min(
            Math.Max(image.Width, image.Height) / SourceSide,
            Math.Min(image.Width, image.Height) / DetailThumbnail.Side);
        return k < 2 ? FullSize(image) : BlockAveraged(image, k);
    }

    private static PhotoPixelEvidence FullSize(Image<Rgb24> image)
    {
        using var grey = image.CloneAs<L8>();
        int width = image.Width;
        int height = image.Height;
        byte[] pixels = new byte[width * height];
        grey.CopyPixelDataTo(pixels);
        byte[] cb = new byte[width * height];
        byte[] cr = new byte[width * height];
        image.ProcessPixelRows(rows =>
        {
            for (int y = 0; y < height; y++)
            {
                var row = rows.GetRowSpan(y);
                for (int x = 0; x < width; x++)
                {
                    var p = row[x];
                    cb[(y * width) + x] = ChromaThumbnail.CbOf(p.R, p.G, p.B);
                    cr[(y * width) + x] = ChromaThumbnail.CrOf(p.R, p.G, p.B);
                }
            }
        });
        return Shrunk(pixels, cb, cr, width, height);
    }

    private static PhotoPixelEvidence Shrunk(ReadOnlySpan<byte> grey, ReadOnlySpan<byte> cb, ReadOnlySpan<byte> cr, int width, int height) => new(
        GreyThumbnail.FromGrey(grey, width, height).Pixels.ToArray(),
        DetailThumbnail.FromGrey(grey, width, height).Pixels.ToArray(),
        ChromaThumbnail.FromPlanes(cb, cr, width, height).Planes.ToArray());

    private static PhotoPixelEvidence BlockAveraged(Image<Rgb24> image, int k)
    {
        int width = (image.Width + k - 1) / k;
        int height = (image.Height + k - 1) / k;
        byte[] grey = ArrayPool<byte>.Shared.Rent(width * height);
        byte[] cb = ArrayPool<byte>.Shared.Rent(width * height);
        byte[] cr = ArrayPool<byte>.Shared.Rent(width * height);
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
                        cb[(by * width) + bx] = ChromaThumbnail.CbOf(red, green, blue);
                        cr[(by * width) + bx] = ChromaThumbnail.CrOf(red, green, blue);
                    }
                }
            });
            int n = width * height;
            return Shrunk(grey.AsSpan(0, n), cb.AsSpan(0, n), cr.AsSpan(0, n), width, height);
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(grey);
            ArrayPool<byte>.Shared.Return(cb);
            ArrayPool<byte>.Shared.Return(cr);
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

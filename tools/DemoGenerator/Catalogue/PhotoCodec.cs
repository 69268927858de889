using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// JPEG in and out through ImageSharp, plus the one edit the planted re-exports need (a box-filter shrink,
/// written here so the generator uses ImageSharp only as a codec).
/// </summary>
internal static class PhotoCodec
{
    public static byte[] EncodeJpeg(Image<Rgb24> image, int quality)
    {
        using var stream = new MemoryStream();
        image.Save(stream, new JpegEncoder { Quality = quality, ColorType = JpegColorType.YCbCrRatio420 });
        return stream.ToArray();
    }

    /// <summary>Decode a JPEG and save it again at another quality, optionally shrunk so its longer side is <paramref name="longSide"/>.</summary>
    public static byte[] ReExport(byte[] jpeg, int quality, int? longSide)
    {
        using var image = Image.Load<Rgb24>(jpeg);
        if (longSide is not int side)
        {
            return EncodeJpeg(image, quality);
        }

        double scale = (double)side / Math.Max(image.Width, image.Height);
        int w = Math.Max(1, (int)Math.Round(image.Width * scale));
        int h = Math.Max(1, (int)Math.Round(image.Height * scale));
        using var small = Shrink(image, w, h);
        return EncodeJpeg(small, quality);
    }

    /// <summary>Area-average downscale: each output pixel is the mean of the source pixels it covers (fractionally weighted).</summary>
    public static Image<Rgb24> Shrink(Image<Rgb24> source, int width, int height)
    {
        var src = new Rgb24[source.Width * source.Height];
        source.CopyPixelDataTo(src);
        var dst = new Rgb24[width * height];
        double sx = (double)source.Width / width;
        double sy = (double)source.Height / height;
        for (int y = 0; y < height; y++)
        {
            for (int x = 0; x < width; x++)
            {
                double r = 0, g = 0, b = 0, total = 0;
                double x0 = x * sx, x1 = (x + 1) * sx, y0 = y * sy, y1 = (y + 1) * sy;
                for (int v = (int)y0; v < Math.Min((int)Math.Ceiling(y1), source.Height); v++)
                {
                    double wy = Math.Min(v + 1, y1) - Math.Max(v, y0);
                    for (int u = (int)x0; u < Math.Min((int)Math.Ceiling(x1), source.Width); u++)
                    {
                        double w = wy * (Math.Min(u + 1, x1) - Math.Max(u, x0));
                        var p = src[(v * source.Width) + u];
                        r += p.R * w;
                        g += p.G * w;
                        b += p.B * w;
                        total += w;
                    }
                }

                dst[(y * width) + x] = new Rgb24((byte)Math.Round(r / total), (byte)Math.Round(g / total), (byte)Math.Round(b / total));
            }
        }

        return Image.LoadPixelData<Rgb24>(dst, width, height);
    }
}

using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Sweeps;

/// <summary>
/// The surface finish of the part in a studio photo, as three numbers taken from its pixels: the part's colour
/// (log blue/red and log green/red of its mean colour) and brightness (log of its mean level), each relative to the
/// background, so a tinted or darker studio backdrop cancels out. The part is every pixel that differs from the
/// background colour (the median of a 4-pixel frame round the edge) by more than 40 levels in some channel. The
/// network's embedding barely tells zinc plating from black oxide or stainless steel on one shape; these numbers do:
/// on the demo catalogue log green/red is 0.01–0.03 for zinc, about 0 for stainless, −0.007 to −0.001 for black oxide
/// (which is also 0.3–0.8 darker in log brightness) and −0.07 to −0.10 for brass. Meant for catalogue photos on a plain
/// backdrop; a photo on a cluttered bench has no single background colour and is not measured. Immutable.
/// </summary>
/// <param name="BlueRed">log(mean blue / mean red) of the part minus the same of the background.</param>
/// <param name="GreenRed">log(mean green / mean red) of the part minus the same of the background.</param>
/// <param name="Brightness">log(mean level of the part / mean level of the background).</param>
public sealed record FinishSignature(double BlueRed, double GreenRed, double Brightness)
{
    /// <summary>Levels (0–255) by which a part pixel differs from the background colour in at least one channel.</summary>
    public const int PartMinDifference = 40;

    /// <summary>Width in pixels of the frame round the edge that gives the background colour.</summary>
    public const int FrameWidth = 4;

    /// <summary>Fewest part pixels (as a share of the photo) for a signature; below it the photo shows no part.</summary>
    public const double MinPartShare = 0.005;

    // Units of the difference: about the spread of each number between photos of one SKU in different poses.
    private const double BlueRedUnit = 0.03;
    private const double GreenRedUnit = 0.01;
    private const double BrightnessUnit = 0.3;

    /// <summary>
    /// The finish of the part in <paramref name="image"/>, or null when the photo is too small, its frame is not
    /// one plain colour (more than half of the frame differs from its median) or it shows almost no part.
    /// </summary>
    public static FinishSignature? Of(Image<Rgb24> image)
    {
        ArgumentNullException.ThrowIfNull(image);
        int width = image.Width, height = image.Height;
        if (width < 4 * FrameWidth || height < 4 * FrameWidth)
        {
            return null;
        }

        var frame = new List<Rgb24>(2 * FrameWidth * (width + height));
        image.ProcessPixelRows(rows =>
        {
            for (var y = 0; y < height; y++)
            {
                var row = rows.GetRowSpan(y);
                for (var x = 0; x < width; x++)
                {
                    if (y < FrameWidth || y >= height - FrameWidth || x < FrameWidth || x >= width - FrameWidth)
                    {
                        frame.Add(row[x]);
                    }
                }
            }
        });

        var background = new Rgb24(Median(frame, p => p.R), Median(frame, p => p.G), Median(frame, p => p.B));
        if (frame.Count(p => IsPart(p, background)) > frame.Count / 2)
        {
            return null;
        }

        double red = 0, green = 0, blue = 0;
        long part = 0;
        image.ProcessPixelRows(rows =>
        {
            for (var y = 0; y < height; y++)
            {
                foreach (var p in rows.GetRowSpan(y))
                {
                    if (IsPart(p, background))
                    {
                        (red, green, blue, part) = (red + p.R, green + p.G, blue + p.B, part + 1);
                    }
                }
            }
        });

        if (part < MinPartShare * width * height)
        {
            return null;
        }

        // +1 keeps a black part or backdrop finite.
        double r = (red / part) + 1, g = (green / part) + 1, b = (blue / part) + 1;
        double br = background.R + 1.0, bg = background.G + 1.0, bb = background.B + 1.0;
        return new FinishSignature(
            Math.Log(b / r) - Math.Log(bb / br),
            Math.Log(g / r) - Math.Log(bg / br),
            Math.Log((r + g + b) / (br + bg + bb)));
    }

    /// <summary>
    /// How different two finishes are, in units of the spread between photos of one SKU: the Euclidean length of the
    /// three differences divided by 0.03, 0.01 and 0.3. Measured on the demo catalogue's studio photos: two photos of
    /// one SKU differ by 0.0–2.3 (median about 0.7; brass, the most coloured, varies most with the light), zinc and
    /// black oxide photos of one shape by 2.6–3.5.
    /// </summary>
    public double DifferenceTo(FinishSignature other)
    {
        ArgumentNullException.ThrowIfNull(other);
        double blueRed = (BlueRed - other.BlueRed) / BlueRedUnit;
        double greenRed = (GreenRed - other.GreenRed) / GreenRedUnit;
        double brightness = (Brightness - other.Brightness) / BrightnessUnit;
        return Math.Sqrt((blueRed * blueRed) + (greenRed * greenRed) + (brightness * brightness));
    }

    private static bool IsPart(Rgb24 p, Rgb24 background) =>
        Math.Abs(p.R - background.R) > PartMinDifference
        || Math.Abs(p.G - background.G) > PartMinDifference
        || Math.Abs(p.B - background.B) > PartMinDifference;

    private static byte Median(List<Rgb24> pixels, Func<Rgb24, byte> channel)
    {
        var counts = new int[256];
        foreach (var p in pixels)
        {
            counts[channel(p)]++;
        }

        for (int level = 0, seen = 0; level < 256; level++)
        {
            seen += counts[level];
            if (2 * seen > pixels.Count)
            {
                return (byte)level;
            }
        }

        return 255;
    }
}

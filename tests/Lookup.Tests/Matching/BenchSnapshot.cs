using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Matching;

/// <summary>
/// Makes a field-style snapshot from real photos: a subject photo shrunk, turned and pasted off-centre onto a
/// background photo (both from tests/reference-data), tone shifted and saved as JPEG, the way a customer's photo
/// shows a part small and at an angle on a busy bench. Shared with tools/MatchBench, which measures on the same
/// snapshots. Deterministic: the placement comes from a seed.
/// </summary>
internal static class BenchSnapshot
{
    /// <summary>Backgrounds: opencv-doc stuff.jpg (objects on a wooden desk) and board.jpg (a circuit board).</summary>
    public static readonly string[] Backgrounds = ["stuff.jpg", "board.jpg"];

    /// <summary>Snapshot size: the 640 × 480 of a small phone photo.</summary>
    public const int Width = 640;

    public const int Height = 480;

    /// <summary>Where and how the subject lands, drawn from <paramref name="seed"/>: longer side 35–55 % of the
    /// snapshot's height, turned ±30°, centre within the middle 40 % of each axis, brightness ×0.85–1.15.</summary>
    public static Placement PlacementFor(int seed)
    {
        var random = new Random(seed);
        return new Placement(
            Scale: 0.35 + (0.20 * random.NextDouble()),
            Degrees: -30 + (60 * random.NextDouble()),
            CentreX: 0.3 + (0.4 * random.NextDouble()),
            CentreY: 0.3 + (0.4 * random.NextDouble()),
            Brightness: (float)(0.85 + (0.3 * random.NextDouble())));
    }

    /// <summary>The snapshot as JPEG (quality 80) bytes.</summary>
    public static byte[] Make(string subjectPath, string backgroundPath, Placement placement)
    {
        using var background = Image.Load<Rgba32>(backgroundPath);
        background.Mutate(x => x.Resize(new ResizeOptions { Size = new Size(Width, Height), Mode = ResizeMode.Crop }));
        using var subject = Image.Load<Rgba32>(subjectPath);
        double longer = Math.Max(subject.Width, subject.Height);
        int w = Math.Max(8, (int)Math.Round(subject.Width * placement.Scale * Height / longer));
        int h = Math.Max(8, (int)Math.Round(subject.Height * placement.Scale * Height / longer));
        subject.Mutate(x => x.Resize(w, h).Rotate((float)placement.Degrees));
        var at = new Point(
            (int)Math.Round((placement.CentreX * Width) - (subject.Width / 2.0)),
            (int)Math.Round((placement.CentreY * Height) - (subject.Height / 2.0)));
        background.Mutate(x => x.DrawImage(subject, at, 1f).Brightness(placement.Brightness));
        using var output = new MemoryStream();
        background.Save(output, new JpegEncoder { Quality = 80 });
        return output.ToArray();
    }

    /// <summary>Scale: subject's longer side as a share of the snapshot height; turn in degrees; centre as shares of
    /// width and height; brightness factor.</summary>
    public readonly record struct Placement(double Scale, double Degrees, double CentreX, double CentreY, float Brightness);
}

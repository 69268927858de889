using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// The edits planted on real photos, each with the relation and edits the sweep must report. The edits are the
/// everyday ones of catalogue work (common practice): a byte copy filed again, a JPEG re-export at quality 40, a
/// half-size export, an 80 % crop, a brightness change, a mirror, a 4° straighten (turn, then cut the largest upright
/// rectangle of the same shape and scale it back to the original size, as photo editors' straighten tools do).
/// </summary>
internal static class PlantedEdits
{
    public static readonly (string Name, PairRelation Relation, CopyEdits Edits)[] All =
    [
        ("byte copy", PairRelation.IdenticalBytes, CopyEdits.None),
        ("jpeg q40", PairRelation.Copy, CopyEdits.None),
        ("resize 50 %", PairRelation.Copy, CopyEdits.Resized),
        ("crop 80 %", PairRelation.Copy, CopyEdits.Cropped),
        ("brightness +30 %", PairRelation.Copy, CopyEdits.None),
        ("mirror", PairRelation.Copy, CopyEdits.Mirrored),
        ("straighten 4°", PairRelation.Copy, CopyEdits.Rotated),
    ];

    /// <summary>The file bytes of edit <paramref name="name"/> applied to a photo (its original file bytes given).</summary>
    public static byte[] Apply(string name, Image<Rgb24> image, byte[] original) => name switch
    {
        "byte copy" => original,
        "jpeg q40" => Jpeg(image, 40),
        "resize 50 %" => Edited(image, c => c.Resize(image.Width / 2, image.Height / 2)),
        "crop 80 %" => Edited(image, c => c.Crop(new Rectangle(image.Width / 10, image.Height / 20, image.Width * 8 / 10, image.Height * 8 / 10))),
        "brightness +30 %" => Edited(image, c => c.Brightness(1.3f)),
        "mirror" => Edited(image, c => c.Flip(FlipMode.Horizontal)),
        "straighten 4°" => Straighten(image, 4f),
        _ => throw new ArgumentOutOfRangeException(nameof(name), name, "Unknown edit."),
    };

    /// <summary>Edited pictures are saved as high-quality JPEG, as a photo editor exports them.</summary>
    private static byte[] Edited(Image<Rgb24> image, Action<IImageProcessingContext> edit)
    {
        using var edited = image.Clone(edit);
        return Jpeg(edited, 92);
    }

    private static byte[] Jpeg(Image<Rgb24> image, int quality)
    {
        using var stream = new MemoryStream();
        image.SaveAsJpeg(stream, new JpegEncoder { Quality = quality });
        return stream.ToArray();
    }

    private static byte[] Straighten(Image<Rgb24> image, float degrees)
    {
        using var turned = image.Clone(c => c.Rotate(degrees));
        var t = degrees * Math.PI / 180;
        var zoom = Math.Cos(t) + (Math.Sin(t) * Math.Max((double)image.Width / image.Height, (double)image.Height / image.Width));
        var (w, h) = ((int)(image.Width / zoom), (int)(image.Height / zoom));
        turned.Mutate(c => c.Crop(new Rectangle((turned.Width - w) / 2, (turned.Height - h) / 2, w, h)).Resize(image.Width, image.Height));
        return Jpeg(turned, 92);
    }
}

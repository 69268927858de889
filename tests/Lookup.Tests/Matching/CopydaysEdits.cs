using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Matching;

/// <summary>
/// The edits of the Copydays protocol as the embedding tests use them (M. Douze et al., CIVR 2009: JPEG, crop and
/// "strong" edits of each original): JPEG quality 30, the central half of the surface, a resize to 25 %, brightness
/// ×1.4. Shared with tools/MatchBench.
/// </summary>
internal static class CopydaysEdits
{
    public static readonly string[] Names = ["jpeg-quality-30", "centre-crop-50-percent", "resize-to-25-percent", "brighter-by-40-percent"];

    /// <summary>The edited copy, encoded: JPEG for the re-encode, lossless PNG otherwise.</summary>
    public static byte[] Apply(string path, string edit)
    {
        using var image = Image.Load(path);
        using var output = new MemoryStream();
        switch (edit)
        {
            case "jpeg-quality-30":
                image.Save(output, new JpegEncoder { Quality = 30 });
                break;
            case "centre-crop-50-percent":
                var (w, h) = ((int)(image.Width * Math.Sqrt(0.5)), (int)(image.Height * Math.Sqrt(0.5)));
                image.Mutate(x => x.Crop(new Rectangle((image.Width - w) / 2, (image.Height - h) / 2, w, h)));
                image.Save(output, new PngEncoder());
                break;
            case "resize-to-25-percent":
                image.Mutate(x => x.Resize(image.Width / 4, image.Height / 4));
                image.Save(output, new PngEncoder());
                break;
            case "brighter-by-40-percent":
                image.Mutate(x => x.Brightness(1.4f));
                image.Save(output, new PngEncoder());
                break;
            default:
                throw new ArgumentException($"unknown edit '{edit}'; one of {string.Join(", ", Names)}", nameof(edit));
        }

        return output.ToArray();
    }
}

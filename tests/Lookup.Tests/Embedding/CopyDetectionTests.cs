using Lookup.Tests.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Embedding;

/// <summary>
/// Copy detection in the manner of the Copydays protocol (M. Douze et al., "Evaluation of GIST descriptors for web-scale
/// image search", CIVR 2009: originals plus JPEG, crop and "strong" edits of each, every copy queried against all
/// originals). Originals are python3-skimage sample photos (tests/reference-data/skimage, see SOURCES.md); each edited
/// copy must have its own original as nearest neighbour among all originals, with the 57 opencv-doc sample images
/// (tests/reference-data/opencv) added to the gallery as distractors.
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class CopyDetectionTests(EmbedderFixture fixture)
{
    private static readonly string[] Originals =
    [
        "astronaut.png", "coffee.png", "chelsea.png", "rocket.jpg", "motorcycle_left.png", "camera.png", "coins.png", "clock_motion.png",
    ];

    public static TheoryData<string> Edits() => ["jpeg-quality-30", "centre-crop-50-percent", "resize-to-25-percent", "brighter-by-40-percent"];

    [Theory]
    [MemberData(nameof(Edits))]
    public void Each_edited_copy_has_its_own_original_as_nearest_neighbour_among_all_originals_and_distractors(string edit)
    {
        var gallery = Originals.ToDictionary(name => name, name => fixture.EmbedFile(ReferenceData.SkImage(name)));
        foreach (var distractor in ReferenceData.OpenCvGallery())
        {
            gallery.Add("opencv/" + Path.GetFileName(distractor), fixture.EmbedFile(distractor));
        }

        foreach (var name in Originals)
        {
            var copy = fixture.EmbedBytes(Edit(ReferenceData.SkImage(name), edit), $"{name} ({edit})");
            var ranking = ExactSearch.Ranking(copy, gallery);
            Assert.True(ranking[0].Name == name, $"{name} after {edit}: nearest were {ExactSearch.Describe(ranking)}");
        }
    }

    /// <summary>Applies one edit and returns the encoded copy: JPEG for the re-encode, lossless PNG otherwise.</summary>
    private static byte[] Edit(string path, string edit)
    {
        using var image = Image.Load(path);
        using var output = new MemoryStream();
        switch (edit)
        {
            case "jpeg-quality-30":
                image.Save(output, new JpegEncoder { Quality = 30 });
                break;
            case "centre-crop-50-percent":
                // Keep the central half of the surface: each side scaled by √0.5.
                var (w, h) = ((int)(image.Width * Math.Sqrt(0.5)), (int)(image.Height * Math.Sqrt(0.5)));
                image.Mutate(x => x.Crop(new Rectangle((image.Width - w) / 2, (image.Height - h) / 2, w, h)));
                image.Save(output, new PngEncoder());
                break;
            case "resize-to-25-percent":
                image.Mutate(x => x.Resize(image.Width / 4, image.Height / 4));
                image.Save(output, new PngEncoder());
                break;
            default:
                image.Mutate(x => x.Brightness(1.4f));
                image.Save(output, new PngEncoder());
                break;
        }

        return output.ToArray();
    }
}

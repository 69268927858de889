using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using Xunit.Abstractions;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// The pixel evidence alone on real photos: every pair is classified as if its embeddings were 0.05 apart (inside the
/// crop band), the hardest case for second views, which then rest on the thumbnails and dHash only.
/// </summary>
public sealed class PlantedCopyEvidenceTests(ITestOutputHelper output)
{
    private const float CloseDistance = 0.05f;

    [Fact]
    public void Every_planted_copy_is_a_copy_with_its_edit_named_and_no_second_view_is()
    {
        var classifier = new PairClassifier(new SweepOptions());
        var (found, planted, wrongEdit) = (0, 0, new List<string>());
        foreach (var source in ReferencePhotos.Sources)
        {
            var original = File.ReadAllBytes(ReferencePhotos.PathOf(source));
            using var image = Image.Load<Rgb24>(original);
            var a = PhotoOf(1, "A", source, original);
            foreach (var (edit, relation, edits) in PlantedEdits.All)
            {
                var b = PhotoOf(2, "B", $"{source} {edit}", PlantedEdits.Apply(edit, image, original));
                var (got, evidence) = classifier.Classify(a, a.Thumbnail, b, b.Thumbnail, CloseDistance);
                planted++;
                found += got == relation ? 1 : 0;
                if (got == relation && evidence.Edits != edits)
                {
                    wrongEdit.Add($"{source} {edit}: {evidence.Edits}");
                }

                output.WriteLine($"{source,-22} {edit,-17} {got,-15} {evidence.Edits,-20} correlation {evidence.Correlation:0.000}");
            }
        }

        var falseCopies = 0;
        foreach (var (first, second) in ReferencePhotos.SecondViews)
        {
            var a = PhotoOf(1, "A", first, File.ReadAllBytes(ReferencePhotos.PathOf(first)));
            var b = PhotoOf(2, "A", second, File.ReadAllBytes(ReferencePhotos.PathOf(second)));
            var (got, evidence) = classifier.Classify(a, a.Thumbnail, b, b.Thumbnail, CloseDistance);
            falseCopies += got >= PairRelation.Copy ? 1 : 0;
            output.WriteLine($"{first} / {second}: {got}, correlation {evidence.Correlation:0.000}, dHash {evidence.HashDistance} bits");
        }

        output.WriteLine($"recall {found}/{planted}, second views called copies {falseCopies}/{ReferencePhotos.SecondViews.Length}");
        Assert.Equal(planted, found);
        Assert.Empty(wrongEdit);
        Assert.Equal(0, falseCopies);
    }

    private static SweepPhoto PhotoOf(int id, string sku, string path, byte[] bytes)
    {
        using var image = Image.Load<Rgb24>(bytes);
        return SweepFixtures.Photo(id, sku, path, image, [1f], bytes);
    }
}

using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// The colour check on a real photo (opencv-doc's fruits.jpg, see tests/reference-data/SOURCES.md): the same grey
/// picture in other colours is what a brass part and the same part in stainless steel look like to grey evidence.
/// </summary>
public sealed class ColourEvidenceTests
{
    [Fact]
    public void The_same_grey_picture_with_its_colours_turned_the_other_way_is_not_a_copy()
    {
        var bytes = File.ReadAllBytes(ReferencePhotos.PathOf("opencv/fruits.jpg"));
        using var image = Image.Load<Rgb24>(bytes);
        using var opposite = image.Clone();
        opposite.ProcessPixelRows(rows =>
        {
            for (var y = 0; y < rows.Height; y++)
            {
                foreach (ref var p in rows.GetRowSpan(y))
                {
                    // Keep BT.709 luma, negate the colour difference: 2Y − (R, G, B).
                    var luma = (0.2126f * p.R) + (0.7152f * p.G) + (0.0722f * p.B);
                    p = new Rgb24(Flip(luma, p.R), Flip(luma, p.G), Flip(luma, p.B));
                }
            }
        });
        var a = SweepFixtures.Photo(1, "A", "a.jpg", image, [1f], bytes);
        var b = SweepFixtures.Photo(2, "B", "b.png", opposite, [1f]);
        var classifier = new PairClassifier(new SweepOptions());

        var (relation, evidence) = classifier.Classify(a, a.Thumbnail, b, b.Thumbnail, 0.05f);
        var (grey, greyEvidence) = classifier.Classify(a with { Chroma = null }, a.Thumbnail, b with { Chroma = null }, b.Thumbnail, 0.05f);

        Assert.Equal(PairRelation.LookAlike, relation);
        Assert.True(evidence.ColourCorrelation < 0, $"colour correlation {evidence.ColourCorrelation}");
        Assert.True(evidence.DetailCorrelation >= new SweepOptions().WholeFrameMinDetailCorrelation, $"detail {evidence.DetailCorrelation}");
        Assert.Equal(PairRelation.Copy, grey);
        Assert.Null(greyEvidence.ColourCorrelation);
    }

    private static byte Flip(float luma, byte channel) => (byte)Math.Clamp(MathF.Round((2 * luma) - channel), 0f, 255f);
}

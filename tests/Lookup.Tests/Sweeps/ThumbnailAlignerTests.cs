using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Sweeps;

public sealed class ThumbnailAlignerTests
{
    private static readonly AlignmentLimits Limits = AlignmentLimits.From(new SweepOptions());

    [Theory]
    [InlineData(0, 0)]
    [InlineData(80, 0)]
    [InlineData(40, 60)]
    public void Search_finds_where_a_crop_came_from(int left, int top)
    {
        using var image = SweepFixtures.Texture(9, 400, 300);
        using var crop = image.Clone(c => c.Crop(new Rectangle(left, top, 320, 240)));

        var result = new ThumbnailAligner().Search(
            Shape(image), SweepFixtures.Thumbnail(image), Shape(crop), SweepFixtures.Thumbnail(crop), Limits);

        // The crop's centre in fractions of the original, and its scale (320 of 400 wide).
        Assert.True(result.Correlation > 0.97f, $"correlation {result.Correlation}");
        Assert.True(result.ContainerIsA);
        Assert.Equal((left + 160) / 400f, result.Hypothesis.CentreX, 0.02f);
        Assert.Equal((top + 120) / 300f, result.Hypothesis.CentreY, 0.02f);
        Assert.Equal(0.8f, result.Hypothesis.Scale, 0.03f);
    }

    [Fact]
    public void Search_finds_a_small_turn()
    {
        using var image = SweepFixtures.Texture(10, 300, 300);
        using var turned = image.Clone(c => c.Rotate(5f));
        var side = (int)(300 / (Math.Cos(5 * Math.PI / 180) + Math.Sin(5 * Math.PI / 180)));
        turned.Mutate(c => c.Crop(new Rectangle((turned.Width - side) / 2, (turned.Height - side) / 2, side, side)).Resize(300, 300));

        var result = new ThumbnailAligner().Search(
            Shape(image), SweepFixtures.Thumbnail(image), Shape(turned), SweepFixtures.Thumbnail(turned), Limits);

        Assert.True(result.Correlation > 0.95f, $"correlation {result.Correlation}");
        Assert.Equal(5f, Math.Abs(result.Hypothesis.AngleDegrees), 1.5f);
    }

    [Fact]
    public void Search_gives_unrelated_pictures_a_low_score()
    {
        var aligner = new ThumbnailAligner();
        for (var seed = 100; seed < 110; seed++)
        {
            using var a = SweepFixtures.Texture(seed);
            using var b = SweepFixtures.Texture(seed + 50);
            var result = aligner.Search(Shape(a), SweepFixtures.Thumbnail(a), Shape(b), SweepFixtures.Thumbnail(b), Limits);
            Assert.True(result.Correlation < 0.9f, $"seeds {seed}/{seed + 50}: correlation {result.Correlation}");
        }
    }

    [Fact]
    public void FullFrame_scores_the_mirrored_picture_one_only_when_mirrored()
    {
        using var image = SweepFixtures.Texture(12);
        using var mirrored = image.Clone(c => c.Flip(FlipMode.Horizontal));

        var (plain, flipped) = new ThumbnailAligner().FullFrame(SweepFixtures.Thumbnail(image), SweepFixtures.Thumbnail(mirrored));

        Assert.True(flipped > 0.999f, $"mirrored {flipped}");
        Assert.True(plain < 0.9f, $"plain {plain}");
    }

    [Fact]
    public void FullFrame_of_a_flat_picture_is_zero()
    {
        var flat = new GreyThumbnail(Enumerable.Repeat((byte)200, GreyThumbnail.Length).ToArray());
        using var image = SweepFixtures.Texture(13);

        Assert.Equal((0f, 0f), new ThumbnailAligner().FullFrame(flat, SweepFixtures.Thumbnail(image)));
    }

    private static PhotoShape Shape(Image image) => new(image.Width, image.Height);
}

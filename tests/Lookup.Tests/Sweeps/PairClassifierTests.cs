using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Sweeps;

public sealed class PairClassifierTests
{
    private static readonly SweepOptions Options = new();
    private readonly Random _random = new(3);

    [Fact]
    public void Classify_finds_identical_bytes_first()
    {
        using var image = SweepFixtures.Texture(1);
        var v = SweepFixtures.RandomUnit(_random);
        var a = SweepFixtures.Photo(1, "A", "a.png", image, v);
        var b = a with { Id = 2, Sku = "B", Path = "b.png" };

        Assert.Equal(PairRelation.IdenticalBytes, Classify(a, b, 0f).Relation);
    }

    [Fact]
    public void Classify_finds_same_pixels_for_another_file_with_an_equal_picture()
    {
        using var image = SweepFixtures.Texture(1);
        var v = SweepFixtures.RandomUnit(_random);
        var a = SweepFixtures.Photo(1, "A", "a.png", image, v);
        var b = SweepFixtures.Photo(2, "A", "b.png", image, v, fileBytes: [.. SweepFixtures.EncodePng(image), 0]);

        Assert.Equal(PairRelation.SamePixels, Classify(a, b, 0.0002f).Relation);
    }

    [Theory]
    [InlineData("resize", CopyEdits.Resized)]
    [InlineData("mirror", CopyEdits.Mirrored)]
    [InlineData("crop", CopyEdits.Cropped)]
    [InlineData("tone", CopyEdits.None)]
    public void Classify_calls_an_edited_picture_a_copy_and_names_the_edit(string edit, CopyEdits expected)
    {
        using var image = SweepFixtures.Texture(5, 320, 240);
        using var edited = edit switch
        {
            "resize" => image.Clone(c => c.Resize(160, 120)),
            "mirror" => image.Clone(c => c.Flip(FlipMode.Horizontal)),
            "crop" => image.Clone(c => c.Crop(new Rectangle(40, 20, 240, 180))),
            _ => image.Clone(c => c.Brightness(1.2f)),
        };
        var v = SweepFixtures.RandomUnit(_random);
        var a = SweepFixtures.Photo(1, "A", "a.png", image, v);
        var b = SweepFixtures.Photo(2, "B", "b.png", edited, SweepFixtures.Near(v, 0.05, _random));

        var (relation, evidence) = Classify(a, b, 0.05f);

        Assert.Equal(PairRelation.Copy, relation);
        Assert.Equal(expected, evidence.Edits);
    }

    [Fact]
    public void Classify_never_calls_a_different_picture_a_copy_however_close_the_embeddings()
    {
        using var first = SweepFixtures.Texture(21);
        using var second = SweepFixtures.Texture(22);
        var v = SweepFixtures.RandomUnit(_random);
        var a = SweepFixtures.Photo(1, "A", "a.png", first, v);
        var sameSku = SweepFixtures.Photo(2, "A", "b.png", second, SweepFixtures.Near(v, 0.01, _random));
        var otherSku = sameSku with { Sku = "B" };

        // Inside one SKU a different view is normal: nothing. Across SKUs: a look-alike.
        Assert.Equal(PairRelation.None, Classify(a, sameSku, 0.01f).Relation);
        Assert.Equal(PairRelation.LookAlike, Classify(a, otherSku, 0.01f).Relation);
    }

    [Fact]
    public void Classify_reports_nothing_beyond_the_look_alike_distance_when_pictures_differ()
    {
        using var first = SweepFixtures.Texture(31);
        using var second = SweepFixtures.Texture(32);
        var v = SweepFixtures.RandomUnit(_random);
        var a = SweepFixtures.Photo(1, "A", "a.png", first, v);
        var b = SweepFixtures.Photo(2, "B", "b.png", second, SweepFixtures.Near(v, 0.15, _random));

        Assert.Equal(PairRelation.None, Classify(a, b, 0.15f).Relation);
    }

    [Fact]
    public void Classify_without_thumbnails_accepts_a_resize_by_dhash_and_refuses_a_crop()
    {
        using var image = SweepFixtures.Texture(41, 320, 240);
        using var resized = image.Clone(c => c.Resize(160, 120));
        using var cropped = image.Clone(c => c.Crop(new Rectangle(40, 30, 240, 180)));
        var v = SweepFixtures.RandomUnit(_random);
        var a = SweepFixtures.Photo(1, "A", "a.png", image, v) with { Thumbnail = null };
        var r = SweepFixtures.Photo(2, "A", "r.png", resized, v) with { Thumbnail = null };
        var c = SweepFixtures.Photo(3, "A", "c.png", cropped, v) with { Thumbnail = null };

        Assert.Equal(PairRelation.Copy, Classify(a, r, 0.02f).Relation);
        Assert.Equal(PairRelation.None, Classify(a, c, 0.05f).Relation);
    }

    private static (PairRelation Relation, PairEvidence Evidence) Classify(SweepPhoto a, SweepPhoto b, float distance) =>
        new PairClassifier(Options).Classify(a, a.Thumbnail, b, b.Thumbnail, distance);
}

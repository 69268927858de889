using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Sweeps;

public sealed class FinishSignatureTests
{
    [Fact]
    public void Of_a_plain_part_on_a_plain_backdrop_is_the_parts_colour_and_level_relative_to_the_backdrop()
    {
        using var image = Scene(new Rgb24(200, 200, 200), new Rgb24(150, 160, 180));

        var finish = FinishSignature.Of(image)!;

        // The definition with +1 on every mean level; the backdrop is grey, so its own ratios are 0.
        Assert.Equal(Math.Log(181.0 / 151.0), finish.BlueRed, 9);
        Assert.Equal(Math.Log(161.0 / 151.0), finish.GreenRed, 9);
        Assert.Equal(Math.Log((151.0 + 161.0 + 181.0) / (201.0 * 3)), finish.Brightness, 9);
    }

    [Fact]
    public void Of_the_same_part_on_a_darker_grey_backdrop_keeps_its_colour_and_gains_brightness()
    {
        // A darker grey backdrop: the part's colour ratios are the same; only its brightness relative to the backdrop moves.
        using var light = Scene(new Rgb24(200, 200, 200), new Rgb24(150, 160, 180));
        using var dark = Scene(new Rgb24(90, 90, 90), new Rgb24(150, 160, 180));

        var a = FinishSignature.Of(light)!;
        var b = FinishSignature.Of(dark)!;

        Assert.Equal(a.BlueRed, b.BlueRed, 9);
        Assert.Equal(a.GreenRed, b.GreenRed, 9);
        Assert.True(b.Brightness > a.Brightness + 0.5, $"{a.Brightness} {b.Brightness}");
    }

    [Fact]
    public void Of_a_photo_without_a_plain_backdrop_or_without_a_part_is_null()
    {
        using var texture = SweepFixtures.Texture(7);
        using var empty = new Image<Rgb24>(64, 64, new Rgb24(200, 200, 200));

        Assert.Null(FinishSignature.Of(texture));
        Assert.Null(FinishSignature.Of(empty));
    }

    [Fact]
    public void DifferenceTo_is_zero_for_one_finish_and_counts_each_number_in_its_own_unit()
    {
        var zinc = new FinishSignature(0.05, 0.02, -0.4);

        Assert.Equal(0, zinc.DifferenceTo(zinc), 12);
        Assert.Equal(1, zinc.DifferenceTo(zinc with { BlueRed = 0.08 }), 9);
        Assert.Equal(1, zinc.DifferenceTo(zinc with { GreenRed = 0.03 }), 9);
        Assert.Equal(1, zinc.DifferenceTo(zinc with { Brightness = -0.1 }), 9);
        Assert.Equal(Math.Sqrt(2), zinc.DifferenceTo(new FinishSignature(0.05, 0.03, -0.1)), 9);
    }

    /// <summary>A 96 × 96 backdrop with a 40 × 30 part in the middle.</summary>
    private static Image<Rgb24> Scene(Rgb24 backdrop, Rgb24 part)
    {
        var image = new Image<Rgb24>(96, 96, backdrop);
        for (var y = 33; y < 63; y++)
        {
            for (var x = 28; x < 68; x++)
            {
                image[x, y] = part;
            }
        }

        return image;
    }
}

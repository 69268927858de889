using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class GreyThumbnailTests
{
    [Fact]
    public void FromGrey_averages_each_block_when_the_image_is_a_whole_multiple_of_32()
    {
        // 64 × 64 where each 2 × 2 block holds 10, 20, 30, 40: every thumbnail pixel is their mean, 25.
        var grey = new byte[64 * 64];
        for (var y = 0; y < 64; y++)
        {
            for (var x = 0; x < 64; x++)
            {
                grey[(y * 64) + x] = (byte)(10 + (10 * (x % 2)) + (20 * (y % 2)));
            }
        }

        var thumbnail = GreyThumbnail.FromGrey(grey, 64, 64);

        Assert.All(thumbnail.Pixels.ToArray(), p => Assert.Equal(25, p));
    }

    [Fact]
    public void FromGrey_weights_partly_covered_pixels_by_their_share()
    {
        // 48 columns: thumbnail column 0 covers source columns 0 and half of 1 → (0·1 + 90·0.5) / 1.5 = 30.
        var grey = new byte[48 * 32];
        for (var y = 0; y < 32; y++)
        {
            grey[(y * 48) + 1] = 90;
        }

        var thumbnail = GreyThumbnail.FromGrey(grey, 48, 32);

        Assert.Equal(30, thumbnail.Pixels[0]);
        Assert.Equal(30, thumbnail.Pixels[1]);
        Assert.Equal(0, thumbnail.Pixels[2]);
    }

    [Fact]
    public void FromGrey_stretches_an_image_smaller_than_the_thumbnail()
    {
        // 2 × 1: left half of the thumbnail takes the left pixel, right half the right one.
        var thumbnail = GreyThumbnail.FromGrey([50, 200], 2, 1);

        Assert.Equal(50, thumbnail.Pixels[0]);
        Assert.Equal(50, thumbnail.Pixels[15]);
        Assert.Equal(200, thumbnail.Pixels[16]);
        Assert.Equal(200, thumbnail.Pixels[GreyThumbnail.Length - 1]);
    }

    [Theory]
    [InlineData(0, 10, 0)]
    [InlineData(10, 10, 99)]
    public void FromGrey_rejects_sizes_that_do_not_match(int width, int height, int length) =>
        Assert.ThrowsAny<ArgumentException>(() => GreyThumbnail.FromGrey(new byte[length], width, height));

    [Fact]
    public void Constructor_rejects_a_wrong_length_and_names_the_fix()
    {
        var error = Assert.Throws<ArgumentException>(() => new GreyThumbnail(new byte[1000]));
        Assert.Contains("1024", error.Message, StringComparison.Ordinal);
        Assert.Contains(nameof(GreyThumbnail.FromGrey), error.Message, StringComparison.Ordinal);
    }
}

using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class DetailThumbnailTests
{
    [Fact]
    public void FromGrey_averages_areas_like_the_small_thumbnail_at_twice_the_side()
    {
        // A 128 × 128 image of 2 × 2 blocks: each detail pixel averages one block exactly (area averaging, common practice).
        var grey = new byte[128 * 128];
        for (var y = 0; y < 128; y++)
        {
            for (var x = 0; x < 128; x++)
            {
                grey[(y * 128) + x] = (byte)((x / 2 * 3) + (y / 2 % 2 * ((x & 1) == 0 ? 2 : 0)));
            }
        }

        var detail = DetailThumbnail.FromGrey(grey, 128, 128);

        Assert.Equal(DetailThumbnail.Length, detail.Pixels.Length);
        Assert.Equal(3 * 5, detail.Pixels[(0 * 64) + 5]);
        Assert.Equal((3 * 5) + 1, detail.Pixels[(1 * 64) + 5]);
    }

    [Fact]
    public void A_detail_thumbnail_of_the_wrong_size_names_both_sizes_and_the_fix()
    {
        var e = Assert.Throws<ArgumentException>(() => new DetailThumbnail(new byte[1024]));

        Assert.Contains("4096 bytes (64 × 64), this one has 1024", e.Message, StringComparison.Ordinal);
        Assert.Contains("DetailThumbnail.FromGrey", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Chroma_planes_of_grey_are_flat_at_128_and_of_a_colour_have_the_bt709_signs()
    {
        // BT.709 colour differences (ITU-R BT.709-6, table 3): grey has none, red has Cr > 0, blue has Cb > 0.
        Assert.Equal((128, 128), (ChromaThumbnail.CbOf(90, 90, 90), ChromaThumbnail.CrOf(90, 90, 90)));
        Assert.True(ChromaThumbnail.CrOf(255, 0, 0) > 200 && ChromaThumbnail.CbOf(255, 0, 0) < 128);
        Assert.True(ChromaThumbnail.CbOf(0, 0, 255) > 200 && ChromaThumbnail.CrOf(0, 0, 255) < 128);
        var e = Assert.Throws<ArgumentException>(() => new ChromaThumbnail(new byte[1024]));
        Assert.Contains("2048 bytes (two 32 × 32 planes), this one has 1024", e.Message, StringComparison.Ordinal);
    }
}

using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Imaging;

public sealed class DifferenceHashTests
{
    [Fact]
    public void Compute_sets_every_bit_for_a_gradient_brightening_to_the_right()
    {
        using var image = Gradient(brighterToTheRight: true);

        Assert.Equal(ulong.MaxValue, DifferenceHash.Compute(image));
    }

    [Fact]
    public void Compute_sets_no_bit_for_a_gradient_darkening_to_the_right_or_a_flat_image()
    {
        using var darkening = Gradient(brighterToTheRight: false);
        using var flat = new Image<Rgb24>(64, 64, new Rgb24(90, 90, 90));

        Assert.Equal(0UL, DifferenceHash.Compute(darkening));
        Assert.Equal(0UL, DifferenceHash.Compute(flat));
    }

    [Fact]
    public void FromGrey_puts_row_0_pair_0_in_the_top_bit_and_runs_row_by_row()
    {
        var grey = new float[9 * 8];
        grey[1] = 1; // row 0: only pair 0 brightens
        grey[(7 * 9) + 8] = 1; // row 7: only the last pair brightens

        Assert.Equal(0x8000_0000_0000_0001UL, DifferenceHash.FromGrey(grey));
    }

    [Theory]
    [InlineData(0UL, 0UL, 0)]
    [InlineData(0UL, ulong.MaxValue, 64)]
    [InlineData(0b1011UL, 0b0001UL, 2)]
    public void Distance_counts_differing_bits(ulong a, ulong b, int expected) =>
        Assert.Equal(expected, DifferenceHash.Distance(a, b));

    [Fact]
    public void Compute_changes_few_bits_for_a_heavy_jpeg_re_encode_and_many_between_different_photos()
    {
        // python3-skimage sample photos (tests/reference-data/skimage).
        var decoder = new PhotoDecoder();
        using var chelsea = decoder.Decode(ReferenceData.SkImage("chelsea.png"));
        using var coffee = decoder.Decode(ReferenceData.SkImage("coffee.png"));
        using var stream = new MemoryStream();
        chelsea.Image.Clone(x => x.Resize(chelsea.Image.Width / 2, 0)).SaveAsJpeg(stream, new JpegEncoder { Quality = 30 });
        using var copy = decoder.Decode(stream.ToArray(), "chelsea-q30-half.jpg");

        var original = DifferenceHash.Compute(chelsea.Image);

        // Thresholds of about 10 bits for "same picture" are common practice for 64-bit dHash.
        Assert.InRange(DifferenceHash.Distance(original, DifferenceHash.Compute(copy.Image)), 0, 6);
        Assert.InRange(DifferenceHash.Distance(original, DifferenceHash.Compute(coffee.Image)), 16, 64);
    }

    [Fact]
    public void ToHex_writes_16_lower_case_digits() =>
        Assert.Equal("00000000000000ff", DifferenceHash.ToHex(255));

    private static Image<Rgb24> Gradient(bool brighterToTheRight)
    {
        var image = new Image<Rgb24>(90, 40);
        for (var y = 0; y < image.Height; y++)
        {
            for (var x = 0; x < image.Width; x++)
            {
                var v = (byte)((brighterToTheRight ? x : image.Width - 1 - x) * 2);
                image[x, y] = new Rgb24(v, v, v);
            }
        }

        return image;
    }
}

using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Imaging;

public sealed class TensorWriterTests
{
    private const int Size = 32;
    private const int Plane = Size * Size;

    [Fact]
    public void WriteTensor_writes_planar_rgb_values_of_a_flat_image()
    {
        using var image = new Image<Rgb24>(50, 40, new Rgb24(10, 20, 30));
        var tensor = new float[3 * Plane];

        TensorWriter.WriteTensor(image, PixelNormalisation.Identity(Size), tensor);

        Assert.All(tensor.AsSpan(0, Plane).ToArray(), v => Assert.Equal(10f, v));
        Assert.All(tensor.AsSpan(Plane, Plane).ToArray(), v => Assert.Equal(20f, v));
        Assert.All(tensor.AsSpan(2 * Plane, Plane).ToArray(), v => Assert.Equal(30f, v));
    }

    [Fact]
    public void WriteTensor_reverses_planes_for_bgr_and_applies_scale_mean_and_std_per_plane()
    {
        using var image = new Image<Rgb24>(Size, Size, new Rgb24(10, 20, 30));
        var normalisation = new PixelNormalisation(Size, ChannelOrder.Bgr, 1f / 255, [0.5f, 0.25f, 0.125f], [2f, 4f, 8f]);
        var tensor = new float[3 * Plane];

        TensorWriter.WriteTensor(image, normalisation, tensor);

        // Plane 0 is blue: (30/255 − 0.5) / 2; plane 1 green: (20/255 − 0.25) / 4; plane 2 red: (10/255 − 0.125) / 8.
        Assert.Equal(((30f / 255) - 0.5f) / 2, tensor[0], 5);
        Assert.Equal(((20f / 255) - 0.25f) / 4, tensor[Plane + 7], 5);
        Assert.Equal(((10f / 255) - 0.125f) / 8, tensor[(3 * Plane) - 1], 5);
    }

    [Fact]
    public void WriteTensor_subtracts_the_mean_image_pixel_by_pixel()
    {
        using var image = new Image<Rgb24>(Size, Size, new Rgb24(100, 100, 100));
        var meanImage = Enumerable.Range(0, 3 * Plane).Select(i => (float)(i % 97)).ToArray();
        var tensor = new float[3 * Plane];

        TensorWriter.WriteTensor(image, new PixelNormalisation(Size, ChannelOrder.Rgb, 1f, [0f, 0f, 0f], [1f, 1f, 1f], meanImage), tensor);

        for (var i = 0; i < tensor.Length; i++)
        {
            Assert.Equal(100f - (i % 97), tensor[i]);
        }
    }

    [Fact]
    public void WriteTensor_takes_the_centre_square_of_a_wide_image()
    {
        // Red | green | blue thirds: the shorter-side resize and centre crop keep only the green third.
        using var image = new Image<Rgb24>(300, 100);
        Fill(image, new Rectangle(0, 0, 100, 100), new Rgb24(255, 0, 0));
        Fill(image, new Rectangle(100, 0, 100, 100), new Rgb24(0, 255, 0));
        Fill(image, new Rectangle(200, 0, 100, 100), new Rgb24(0, 0, 255));
        var tensor = new float[3 * Plane];

        TensorWriter.WriteTensor(image, PixelNormalisation.Identity(Size), tensor);

        Assert.All(tensor.AsSpan(0, Plane).ToArray(), v => Assert.Equal(0f, v));
        Assert.All(tensor.AsSpan(Plane, Plane).ToArray(), v => Assert.Equal(255f, v));
        Assert.All(tensor.AsSpan(2 * Plane, Plane).ToArray(), v => Assert.Equal(0f, v));
    }

    [Fact]
    public void WriteTensor_reads_only_the_given_region()
    {
        using var image = new Image<Rgb24>(200, 100, new Rgb24(255, 0, 0));
        Fill(image, new Rectangle(120, 10, 60, 80), new Rgb24(0, 0, 255));
        var tensor = new float[3 * Plane];

        TensorWriter.WriteTensor(image, new Rectangle(120, 10, 60, 80), PixelNormalisation.Identity(Size), tensor);

        Assert.All(tensor.AsSpan(0, Plane).ToArray(), v => Assert.Equal(0f, v));
        Assert.All(tensor.AsSpan(2 * Plane, Plane).ToArray(), v => Assert.Equal(255f, v));
    }

    [Fact]
    public void WriteTensor_of_a_region_equals_writing_the_cropped_image()
    {
        using var photo = new PhotoDecoder().Decode(ReferenceData.SkImage("chelsea.png"));
        var region = new Rectangle(100, 40, 220, 180);
        using var cropped = photo.Image.Clone(x => x.Crop(region));
        var fromRegion = new float[3 * Plane];
        var fromCrop = new float[3 * Plane];

        TensorWriter.WriteTensor(photo.Image, region, PixelNormalisation.Identity(Size), fromRegion);
        TensorWriter.WriteTensor(cropped, PixelNormalisation.Identity(Size), fromCrop);

        Assert.Equal(fromCrop, fromRegion);
    }

    [Theory]
    [InlineData(0, 0, 0, 10)]
    [InlineData(-1, 0, 10, 10)]
    [InlineData(45, 0, 10, 10)]
    [InlineData(0, 35, 10, 10)]
    public void WriteTensor_refuses_a_region_outside_the_image(int x, int y, int width, int height)
    {
        using var image = new Image<Rgb24>(50, 40);

        Assert.Throws<ArgumentOutOfRangeException>(() => TensorWriter.WriteTensor(image, new Rectangle(x, y, width, height), PixelNormalisation.Identity(Size), new float[3 * Plane]));
    }

    [Fact]
    public void WriteTensor_refuses_a_destination_that_is_too_short()
    {
        using var image = new Image<Rgb24>(50, 40);

        var error = Assert.Throws<ArgumentException>(() => TensorWriter.WriteTensor(image, PixelNormalisation.Identity(Size), new float[(3 * Plane) - 1]));
        Assert.Contains("3072", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0, 0, 300, 100, 100, 0, 100)]
    [InlineData(0, 0, 100, 300, 0, 100, 100)]
    [InlineData(10, 20, 51, 50, 10, 20, 50)]
    [InlineData(10, 20, 53, 50, 11, 20, 50)]
    public void CentreSquare_keeps_the_largest_centred_square(int x, int y, int w, int h, int ex, int ey, int side) =>
        Assert.Equal(new Rectangle(ex, ey, side, side), TensorWriter.CentreSquare(new Rectangle(x, y, w, h)));

    private static void Fill(Image<Rgb24> image, Rectangle area, Rgb24 colour)
    {
        for (var y = area.Top; y < area.Bottom; y++)
        {
            for (var x = area.Left; x < area.Right; x++)
            {
                image[x, y] = colour;
            }
        }
    }
}

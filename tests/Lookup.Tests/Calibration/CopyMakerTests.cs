using Lookup.Calibration;
using Lookup.Imaging;
using Lookup.Tests.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Calibration;

/// <summary>Copies of scikit-image's chelsea.png (451 × 300; Debian python3-skimage, CC0).</summary>
public sealed class CopyMakerTests : IDisposable
{
    private readonly PhotoDecoder _decoder = new();
    private readonly DecodedPhoto _chelsea;

    public CopyMakerTests() => _chelsea = _decoder.Decode(ReferencePhotos.PathOf("skimage/chelsea.png"));

    [Theory]
    [InlineData(0.6f, 0.9f, 271, 270)]
    [InlineData(0.9f, 0.6f, 406, 180)]
    public void A_crop_keeps_the_drawn_share_of_each_side(float width, float height, int expectedWidth, int expectedHeight)
    {
        using var copy = Make(new CopyEdit(CopyEditKind.Crop) { CropWidth = width, CropHeight = height, CropX = 1, CropY = 0 });

        Assert.Equal((expectedWidth, expectedHeight), (copy.Image.Width, copy.Image.Height));
        Assert.Equal(PhotoFormat.Jpeg, copy.Info.Format);
    }

    [Theory]
    [InlineData(0.25f, 113, 75)]
    [InlineData(0.05f, 48, 32)]
    public void A_shrunk_copy_keeps_the_shape_and_never_goes_below_32_pixels(float scale, int expectedWidth, int expectedHeight)
    {
        using var copy = Make(new CopyEdit(CopyEditKind.Downscale) { Scale = scale, Quality = 85 });

        Assert.Equal((expectedWidth, expectedHeight), (copy.Image.Width, copy.Image.Height));
    }

    [Fact]
    public void A_mirrored_copy_has_the_original_left_edge_on_its_right()
    {
        using var copy = Make(new CopyEdit(CopyEditKind.Mirror) { Mirror = true });

        double mirrored = MeanAbsoluteDifference(_chelsea.Image, copy.Image, x => _chelsea.Image.Width - 1 - x);
        double straight = MeanAbsoluteDifference(_chelsea.Image, copy.Image, x => x);
        Assert.True(mirrored < 6, $"mirrored difference {mirrored:0.0}");
        Assert.True(straight > 3 * mirrored, $"straight {straight:0.0} vs mirrored {mirrored:0.0}");
    }

    [Fact]
    public void A_straightened_copy_keeps_the_size_and_shows_no_empty_corner()
    {
        using var copy = Make(new CopyEdit(CopyEditKind.Straighten) { Degrees = -6 });

        Assert.Equal((451, 300), (copy.Image.Width, copy.Image.Height));
        foreach (var (x, y) in new[] { (0, 0), (450, 0), (0, 299), (450, 299) })
        {
            var p = copy.Image[x, y];
            Assert.True(p.R + p.G + p.B > 60, $"corner ({x}, {y}) is {p}");
        }
    }

    [Fact]
    public void A_colour_cast_raises_one_channel_and_lowers_the_other()
    {
        using var copy = Make(new CopyEdit(CopyEditKind.WhiteBalance) { RedGain = 1.15f, BlueGain = 0.85f });

        var (r0, _, b0) = Means(_chelsea.Image);
        var (r1, _, b1) = Means(copy.Image);
        Assert.True(r1 > r0 + 5 && b1 < b0 - 5, $"red {r0:0} → {r1:0}, blue {b0:0} → {b1:0}");
    }

    [Fact]
    public void The_plan_is_the_same_for_a_seed_and_path_and_differs_between_photos()
    {
        var kinds = Enum.GetValues<CopyEditKind>();

        var first = CopyEditPlan.Draw(CopyEditPlan.ForPhoto(1, "SKU-1/front.jpg"), kinds);
        var again = CopyEditPlan.Draw(CopyEditPlan.ForPhoto(1, "SKU-1/front.jpg"), kinds);
        var other = CopyEditPlan.Draw(CopyEditPlan.ForPhoto(1, "SKU-1/back.jpg"), kinds);

        Assert.Equal(first, again);
        Assert.NotEqual(first, other);
        Assert.Equal(kinds, first.Select(e => e.Kind));
    }

    [Fact]
    public void Drawn_parameters_stay_inside_the_stated_ranges()
    {
        for (int photo = 0; photo < 300; photo++)
        {
            foreach (var e in CopyEditPlan.Draw(CopyEditPlan.ForPhoto(3, $"p{photo}.jpg"), Enum.GetValues<CopyEditKind>()))
            {
                Assert.InRange(e.Quality, 25, 90);
                Assert.InRange(e.Scale, 0.2f, 1f);
                Assert.InRange(e.CropWidth, 0.6f, 1f);
                Assert.InRange(e.CropHeight, 0.6f, 1f);
                Assert.InRange(Math.Abs(e.Degrees), e.Kind == CopyEditKind.Straighten ? 1f : 0f, 6f);
                Assert.InRange(e.RedGain, 0.85f, 1.15f);
                Assert.InRange(e.Brightness, 0.7f, 1.35f);
            }
        }
    }

    public void Dispose() => _chelsea.Dispose();

    private DecodedPhoto Make(CopyEdit edit) => CopyMaker.Make(_chelsea.Image, edit, _decoder, "chelsea-copy.jpg");

    private static double MeanAbsoluteDifference(Image<Rgb24> a, Image<Rgb24> b, Func<int, int> column)
    {
        double sum = 0;
        for (int y = 0; y < a.Height; y += 3)
        {
            for (int x = 0; x < a.Width; x += 3)
            {
                var p = a[column(x), y];
                var q = b[x, y];
                sum += Math.Abs(p.R - q.R) + Math.Abs(p.G - q.G) + Math.Abs(p.B - q.B);
            }
        }

        return sum / (3.0 * ((a.Height + 2) / 3) * ((a.Width + 2) / 3));
    }

    private static (double R, double G, double B) Means(Image<Rgb24> image)
    {
        double r = 0, g = 0, b = 0;
        for (int y = 0; y < image.Height; y++)
        {
            for (int x = 0; x < image.Width; x++)
            {
                var p = image[x, y];
                (r, g, b) = (r + p.R, g + p.G, b + p.B);
            }
        }

        double n = image.Width * image.Height;
        return (r / n, g / n, b / n);
    }
}

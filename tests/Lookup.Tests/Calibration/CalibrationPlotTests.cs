using Lookup.Calibration;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Calibration;

/// <summary>The plot of the reference catalogue's calibration (see <see cref="ReferenceCatalogue"/>).</summary>
[Collection(ReferenceCatalogueCollection.Name)]
public sealed class CalibrationPlotTests(ReferenceCatalogue catalogue)
{
    [Theory]
    [InlineData(960, 540)]
    [InlineData(640, 360)]
    [InlineData(320, 200)]
    [InlineData(1600, 900)]
    public void RenderPng_writes_a_png_of_the_stated_size(int width, int height)
    {
        byte[] png = CalibrationPlot.RenderPng(CalibrationRecord.From(catalogue.Result), width, height);

        Assert.Equal(PngFormat.Instance, Image.DetectFormat(png));
        using var image = Image.Load<Rgb24>(png);
        Assert.Equal((width, height), (image.Width, image.Height));
    }

    [Fact]
    public void The_band_limits_are_dashed_lines_in_their_colours_at_their_distances()
    {
        var r = catalogue.Result;
        var frame = PlotFrame.For(r.Histograms, r.Limits.SamePart, 960, 540);

        using var image = Image.Load<Rgb24>(CalibrationPlot.RenderPng(r.Histograms, r.Limits.Copy, r.Limits.SamePart));

        double copyShare = ColumnShare(image, frame.X(r.Limits.Copy), frame, CalibrationPlot.CopyLimitColour);
        double sameShare = ColumnShare(image, frame.X(r.Limits.SamePart), frame, CalibrationPlot.SamePartLimitColour);
        Assert.InRange(copyShare, 0.35, 0.6);
        Assert.InRange(sameShare, 0.35, 0.6);
        Assert.Equal(0, ColumnShare(image, frame.X(r.Limits.Copy) - 3, frame, CalibrationPlot.CopyLimitColour));
    }

    [Fact]
    public void Each_group_is_drawn_in_its_colour_and_the_copy_band_is_shaded()
    {
        var r = catalogue.Result;
        var frame = PlotFrame.For(r.Histograms, r.Limits.SamePart, 960, 540);

        using var image = Image.Load<Rgb24>(CalibrationPlot.RenderPng(r.Histograms, r.Limits.Copy, r.Limits.SamePart));

        Assert.True(Count(image, CalibrationPlot.CopiesColour) > 100);
        Assert.True(Count(image, CalibrationPlot.SiblingsColour) > 100);
        Assert.True(Count(image, CalibrationPlot.StrangersColour) > 100);
        Assert.Equal(CalibrationPlot.CopyBandTint, image[frame.X(r.Limits.Copy) - 2, frame.Top + 1]);
        Assert.Equal(new Rgb24(255, 255, 255), image[frame.Right - 2, frame.Top + 2]);
    }

    [Theory]
    [InlineData(319, 540)]
    [InlineData(960, 199)]
    [InlineData(5000, 540)]
    public void RenderPng_refuses_sizes_outside_320x200_to_4096x4096(int width, int height) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => CalibrationPlot.RenderPng(catalogue.Result.Histograms, 0.1f, 0.2f, width, height));

    private static double ColumnShare(Image<Rgb24> image, int x, PlotFrame frame, Rgb24 colour)
    {
        int hits = 0;
        for (int y = frame.Top; y < frame.Bottom; y++)
        {
            hits += image[x, y] == colour ? 1 : 0;
        }

        return (double)hits / (frame.Bottom - frame.Top);
    }

    private static int Count(Image<Rgb24> image, Rgb24 colour)
    {
        int count = 0;
        for (int y = 0; y < image.Height; y++)
        {
            for (int x = 0; x < image.Width; x++)
            {
                count += image[x, y] == colour ? 1 : 0;
            }
        }

        return count;
    }
}

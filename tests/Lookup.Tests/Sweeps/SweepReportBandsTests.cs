using System.Buffers.Binary;
using System.Text.RegularExpressions;
using Lookup.Calibration;
using Lookup.Store;
using Lookup.Sweeps;
using Lookup.Tests.Store;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Png;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// The HTML report says where its distance bands come from: a calibrated index's plot embedded as a data: PNG with
/// its caption, or a note that the bands are defaults. Runs <see cref="IndexSweep"/> on a real index file holding the
/// synthetic catalogue.
/// </summary>
public sealed partial class SweepReportBandsTests : IDisposable
{
    private static readonly DateTime CalibratedAt = new(2026, 11, 30, 8, 0, 0, DateTimeKind.Utc);
    private readonly TempIndex _index = new();

    public SweepReportBandsTests() => SyntheticIndex.Add(_index.Path, SyntheticCatalogue.Build());

    public void Dispose() => _index.Dispose();

    [Fact]
    public void A_calibrated_index_gets_its_plot_embedded_as_a_valid_png_with_a_caption()
    {
        Calibrate();

        var result = IndexSweep.Run(_index.Path, new IndexSweepOptions { Store = false });
        var page = Render(result);

        Assert.NotNull(result.Calibration);
        var match = Assert.Single(PngSources().Matches(page));
        var png = Convert.FromBase64String(match.Groups[1].Value);
        // PNG signature and IHDR layout from the PNG specification (W3C / ISO/IEC 15948, sections 5.2 and 11.2.2).
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, png[..8]);
        Assert.Equal("IHDR"u8.ToArray(), png[12..16]);
        Assert.Equal(CalibrationPlot.DefaultWidth, BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(16)));
        Assert.Equal(CalibrationPlot.DefaultHeight, BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(20)));
        Assert.Equal(PngFormat.Instance, Image.DetectFormat(png));
        using (var image = Image.Load(png))
        {
            Assert.Equal((CalibrationPlot.DefaultWidth, CalibrationPlot.DefaultHeight), (image.Width, image.Height));
        }

        Assert.Contains("Calibrated 2026-11-30 08:00 UTC on 240 photos (720 planted copies; seed 7)", page, StringComparison.Ordinal);
        Assert.Contains("copy ≤ 0.180, same part ≤ 0.300", page, StringComparison.Ordinal);
        Assert.Contains("strangers inside the copy band 3 of 5000 (target 0.1 %)", page, StringComparison.Ordinal);
        Assert.DoesNotContain("has not been calibrated", page, StringComparison.Ordinal);
        Assert.Contains("img-src data:", page, StringComparison.Ordinal);
    }

    [Fact]
    public void An_uncalibrated_index_gets_a_note_that_the_bands_are_defaults_and_how_to_calibrate()
    {
        var result = IndexSweep.Run(_index.Path, new IndexSweepOptions { Store = false });
        var page = Render(result);

        Assert.Null(result.Calibration);
        Assert.Contains("This index has not been calibrated: the sweep used its default bands", page, StringComparison.Ordinal);
        Assert.Contains("<code>lookup calibrate --index FILE</code>", page, StringComparison.Ordinal);
        Assert.DoesNotContain("data:image/png", page, StringComparison.Ordinal);
    }

    private static string Render(IndexSweepResult result)
    {
        using var writer = new StringWriter();
        SweepHtmlWriter.Write(result.Report, writer, calibration: result.Calibration);
        return writer.ToString();
    }

    private void Calibrate()
    {
        // Bin counts shaped like a calibration: copies near 0, siblings in between, strangers far (fixture values).
        var copies = new int[60];
        var siblings = new int[60];
        var strangers = new int[60];
        for (var i = 0; i < 60; i++)
        {
            copies[i] = i < 18 ? 200 - (10 * i) : 0;
            siblings[i] = i is >= 5 and < 40 ? 30 : 0;
            strangers[i] = i >= 15 ? 40 * (i - 14) : 0;
        }

        using var file = IndexFile.Open(_index.Path, IndexAccess.Write);
        file.InTransaction(() =>
        {
            new VerdictThresholds(0.18f, 0.30f, 0.10f, "calibrate", CalibratedAt, 240, 240, "fixture", 0.001).Write(file);
            new CalibrationRecord
            {
                CalibratedUtc = CalibratedAt,
                Copy = 0.18f,
                SamePart = 0.30f,
                TargetFalseMatchRate = 0.001,
                SamePartFalseMatchRate = 0.01,
                Seed = 7,
                PhotosSampled = 240,
                Copies = 720,
                CopiesInCopyBand = new RateCount(700, 720),
                StrangersInCopyBand = new RateCount(3, 5000),
                StrangersInSamePartBand = new RateCount(40, 5000),
                SiblingsInSamePartBand = new RateCount(300, 320),
                Histograms = new DistanceHistograms(0.01f, copies, siblings, strangers),
            }.Write(file);
        });
    }

    [GeneratedRegex("src=\"data:image/png;base64,([A-Za-z0-9+/=]+)\"")]
    private static partial Regex PngSources();
}

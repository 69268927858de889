using System.Globalization;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Calibration;

/// <summary>
/// Draws the calibration histograms as a PNG: for copies, siblings and strangers, the share of the group in each
/// distance bin on a log scale (so the few strangers near the copy band stay visible beside thousands further out),
/// the copy and same-part bands shaded, and their limits as dashed lines. Drawn pixel by pixel with the project's
/// own 5 × 7 font; no plotting library.
/// </summary>
public static class CalibrationPlot
{
    /// <summary>Default width in pixels.</summary>
    public const int DefaultWidth = 960;

    /// <summary>Default height in pixels.</summary>
    public const int DefaultHeight = 540;

    /// <summary>Smallest width and height accepted.</summary>
    public const int MinWidth = 320, MinHeight = 200;

    /// <summary>Largest side accepted.</summary>
    public const int MaxSide = 4096;

    internal static readonly Rgb24 CopiesColour = new(0, 135, 100);
    internal static readonly Rgb24 SiblingsColour = new(40, 90, 200);
    internal static readonly Rgb24 StrangersColour = new(200, 65, 40);
    internal static readonly Rgb24 CopyLimitColour = new(0, 80, 55);
    internal static readonly Rgb24 SamePartLimitColour = new(150, 95, 0);
    internal static readonly Rgb24 CopyBandTint = new(226, 243, 235);
    internal static readonly Rgb24 SamePartBandTint = new(250, 241, 219);
    private static readonly Rgb24 Ink = new(30, 30, 30);
    private static readonly Rgb24 Grid = new(225, 225, 225);

    /// <summary>The histograms of a stored calibration, with its limits marked.</summary>
    public static byte[] RenderPng(CalibrationRecord record, int width = DefaultWidth, int height = DefaultHeight)
    {
        ArgumentNullException.ThrowIfNull(record);
        string title = string.Create(CultureInfo.InvariantCulture, $"CALIBRATED {record.CalibratedUtc:yyyy-MM-dd}: {record.PhotosSampled} PHOTOS, {record.Copies} COPIES");
        return RenderPng(record.Histograms, record.Copy, record.SamePart, width, height, title);
    }

    /// <summary>
    /// Renders <paramref name="histograms"/> with the band limits <paramref name="copy"/> and
    /// <paramref name="samePart"/> marked, as PNG file bytes of exactly <paramref name="width"/> × <paramref name="height"/>.
    /// </summary>
    public static byte[] RenderPng(DistanceHistograms histograms, float copy, float samePart, int width = DefaultWidth, int height = DefaultHeight, string? title = null)
    {
        ArgumentNullException.ThrowIfNull(histograms);
        ArgumentOutOfRangeException.ThrowIfLessThan(width, MinWidth);
        ArgumentOutOfRangeException.ThrowIfLessThan(height, MinHeight);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(width, MaxSide);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(height, MaxSide);
        var frame = PlotFrame.For(histograms, samePart, width, height);
        var canvas = new PlotCanvas(width, height);
        int s = frame.Scale;

        canvas.Fill(frame.Left, frame.Top, frame.X(copy) + 1, frame.Bottom, CopyBandTint);
        canvas.Fill(frame.X(copy) + 1, frame.Top, frame.X(samePart) + 1, frame.Bottom, SamePartBandTint);
        DrawGrid(canvas, frame);
        DrawSeries(canvas, frame, histograms.BinWidth, histograms.Strangers, StrangersColour);
        DrawSeries(canvas, frame, histograms.BinWidth, histograms.Siblings, SiblingsColour);
        DrawSeries(canvas, frame, histograms.BinWidth, histograms.Copies, CopiesColour);
        canvas.DashedVerticalLine(frame.X(copy), frame.Top, frame.Bottom, CopyLimitColour, s, 4 * s);
        canvas.DashedVerticalLine(frame.X(samePart), frame.Top, frame.Bottom, SamePartLimitColour, s, 4 * s);
        DrawAxes(canvas, frame, histograms.BinWidth);
        DrawLegend(canvas, frame, histograms);
        DrawCaptions(canvas, frame, title ?? "DISTANCE HISTOGRAMS AND VERDICT BANDS", copy, samePart);
        return canvas.ToPng();
    }

    private static void DrawGrid(PlotCanvas canvas, PlotFrame frame)
    {
        for (int decade = frame.LowestDecade + 1; decade <= 0; decade++)
        {
            canvas.HorizontalLine(frame.Left, frame.Right, frame.Y(Math.Pow(10, decade)), Grid);
        }
    }

    private static void DrawSeries(PlotCanvas canvas, PlotFrame frame, float binWidth, int[] counts, Rgb24 colour)
    {
        double total = counts.Sum();
        if (total == 0)
        {
            return;
        }

        int s = frame.Scale;
        int bins = Math.Min(counts.Length, (int)MathF.Ceiling((frame.XMax / binWidth) - 1e-3f));
        int previousY = frame.Bottom;
        for (int bin = 0; bin < bins; bin++)
        {
            int x0 = frame.X(bin * binWidth);
            int x1 = frame.X((bin + 1) * binWidth);
            int y = frame.Y(counts[bin] / total);
            canvas.Blend(x0, y, x1, frame.Bottom, colour, 0.18f);
            canvas.VerticalLine(x0, previousY, y, colour, s);
            canvas.HorizontalLine(x0, x1, y, colour, s);
            previousY = y;
        }

        canvas.VerticalLine(frame.X(bins * binWidth), previousY, frame.Bottom, colour, s);
    }

    private static void DrawAxes(PlotCanvas canvas, PlotFrame frame, float binWidth)
    {
        int s = frame.Scale;
        int th = PlotCanvas.TextHeight(s);
        canvas.HorizontalLine(frame.Left, frame.Right, frame.Bottom, Ink, s);
        canvas.VerticalLine(frame.Left, frame.Top, frame.Bottom, Ink, s);

        float step = frame.XMax > 1f ? 0.2f : frame.XMax > 0.4f ? 0.1f : 0.05f;
        for (int i = 0; i * step <= frame.XMax + 1e-4f; i++)
        {
            float d = i * step;
            int x = frame.X(d);
            canvas.VerticalLine(x, frame.Bottom, frame.Bottom + (4 * s), Ink, s);
            string label = d.ToString("0.##", CultureInfo.InvariantCulture);
            int w = PlotCanvas.TextWidth(label, s);
            canvas.Text(Math.Clamp(x - (w / 2), 0, canvas.Width - w), frame.Bottom + (7 * s), label, Ink, s);
        }

        for (int decade = frame.LowestDecade; decade <= 0; decade++)
        {
            int y = frame.Y(Math.Pow(10, decade));
            canvas.HorizontalLine(frame.Left - (4 * s), frame.Left, y, Ink, s);
            string label = decade switch { 0 => "1", -1 => "0.1", -2 => "0.01", _ => string.Create(CultureInfo.InvariantCulture, $"1E{decade}") };
            canvas.Text(frame.Left - (6 * s) - PlotCanvas.TextWidth(label, s), y - (th / 2), label, Ink, s);
        }

        string axis = string.Create(CultureInfo.InvariantCulture, $"COSINE DISTANCE (BINS OF {binWidth:0.###})");
        canvas.Text(frame.Left + ((frame.Right - frame.Left - PlotCanvas.TextWidth(axis, s)) / 2), frame.Bottom + (7 * s) + th + (5 * s), axis, Ink, s);
    }

    private static void DrawLegend(PlotCanvas canvas, PlotFrame frame, DistanceHistograms histograms)
    {
        int s = frame.Scale;
        int th = PlotCanvas.TextHeight(s);
        (string Text, Rgb24 Colour)[] rows =
        [
            (Label("COPIES", histograms.Copies), CopiesColour),
            (Label("SIBLINGS", histograms.Siblings), SiblingsColour),
            (Label("STRANGERS", histograms.Strangers), StrangersColour),
        ];
        int textWidth = rows.Max(r => PlotCanvas.TextWidth(r.Text, s));
        int boxWidth = th + (12 * s) + textWidth;
        int boxHeight = (rows.Length * (th + (4 * s))) + (4 * s);
        int x0 = frame.Right - boxWidth - (6 * s);
        int y0 = frame.Top + (6 * s);
        canvas.Fill(x0, y0, x0 + boxWidth, y0 + boxHeight, new Rgb24(255, 255, 255));
        canvas.HorizontalLine(x0, x0 + boxWidth, y0, Grid, s);
        canvas.HorizontalLine(x0, x0 + boxWidth, y0 + boxHeight, Grid, s);
        canvas.VerticalLine(x0, y0, y0 + boxHeight, Grid, s);
        canvas.VerticalLine(x0 + boxWidth, y0, y0 + boxHeight, Grid, s);
        for (int i = 0; i < rows.Length; i++)
        {
            int y = y0 + (4 * s) + (i * (th + (4 * s)));
            canvas.Fill(x0 + (4 * s), y, x0 + (4 * s) + th, y + th, rows[i].Colour);
            canvas.Text(x0 + (8 * s) + th, y, rows[i].Text, Ink, s);
        }
    }

    private static string Label(string name, int[] counts) =>
        string.Create(CultureInfo.InvariantCulture, $"{name} {counts.Sum()}");

    private static void DrawCaptions(PlotCanvas canvas, PlotFrame frame, string title, float copy, float samePart)
    {
        int s = frame.Scale;
        int line = PlotCanvas.TextHeight(s) + (5 * s);
        canvas.Text(frame.Left, 4 * s, title, Ink, s);
        canvas.Text(frame.Left, (4 * s) + line, "SHARE OF EACH GROUP PER BIN, LOG SCALE", Ink, s);

        // The copy label ends at its line and the same-part label starts at its line; when the copy label would
        // run into the y axis it moves right of its line, and the same-part label moves along after it.
        int y = (4 * s) + (2 * line);
        string copyText = string.Create(CultureInfo.InvariantCulture, $"COPY {copy:0.000}");
        string sameText = string.Create(CultureInfo.InvariantCulture, $"SAME PART {samePart:0.000}");
        int copyWidth = PlotCanvas.TextWidth(copyText, s);
        int sameWidth = PlotCanvas.TextWidth(sameText, s);
        int copyX = frame.X(copy) - copyWidth - (3 * s);
        if (copyX < frame.Left)
        {
            copyX = frame.X(copy) + (3 * s);
        }

        int sameX = Math.Max(frame.X(samePart) + (3 * s), copyX + copyWidth + (8 * s));
        canvas.Text(Math.Clamp(copyX, 0, canvas.Width - copyWidth), y, copyText, CopyLimitColour, s);
        canvas.Text(Math.Clamp(sameX, 0, canvas.Width - sameWidth), y, sameText, SamePartLimitColour, s);
    }
}

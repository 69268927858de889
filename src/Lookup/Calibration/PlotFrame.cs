namespace Lookup.Calibration;

/// <summary>
/// Where the histogram sits on the canvas and how distances and shares map to pixels: x linear from 0 to
/// <see cref="XMax"/>, y as log10 of the share from <see cref="LowestDecade"/> (bottom) to 0 (top, a share of 1).
/// </summary>
/// <param name="Left">First pixel column of the plot area.</param>
/// <param name="Top">First pixel row of the plot area.</param>
/// <param name="Right">Last pixel column of the plot area.</param>
/// <param name="Bottom">Last pixel row of the plot area (the x axis).</param>
/// <param name="XMax">Distance at the right edge.</param>
/// <param name="LowestDecade">log10 of the share at the bottom edge (negative).</param>
/// <param name="Scale">Font cell size in pixels.</param>
internal sealed record PlotFrame(int Left, int Top, int Right, int Bottom, float XMax, int LowestDecade, int Scale)
{
    public int X(float distance) => Left + (int)MathF.Round(Math.Clamp(distance / XMax, 0f, 1f) * (Right - Left));

    public int Y(double share)
    {
        if (share <= 0)
        {
            return Bottom;
        }

        double position = (Math.Clamp(Math.Log10(share), LowestDecade, 0) - LowestDecade) / -LowestDecade;
        return Bottom - (int)Math.Round(position * (Bottom - Top));
    }

    public static PlotFrame For(DistanceHistograms histograms, float samePart, int width, int height)
    {
        int scale = width >= 640 && height >= 400 ? 2 : 1;
        int line = PlotCanvas.TextHeight(scale) + (5 * scale);
        int left = PlotCanvas.TextWidth("1E-10", scale) + (10 * scale);
        int top = (3 * line) + (4 * scale);
        int bottom = height - 1 - ((2 * line) + (6 * scale));
        int right = width - 1 - (14 * scale);

        float reach = Math.Max(histograms.HighestDistance, (float.IsFinite(samePart) ? samePart : 0) + 0.05f);
        float xMax = Math.Clamp(MathF.Ceiling((reach * 10) - 1e-4f) / 10, 0.1f, 2f);

        int largest = Math.Max(1, new[] { histograms.Copies.Sum(), histograms.Siblings.Sum(), histograms.Strangers.Sum() }.Max());
        int lowest = -Math.Clamp((int)Math.Floor(Math.Log10(largest)) + 1, 1, 9);
        return new PlotFrame(left, top, right, bottom, xMax, lowest, scale);
    }
}

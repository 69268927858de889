namespace Lookup.Sweeps;

/// <summary>
/// Scores one <see cref="AlignmentHypothesis"/>: samples the container thumbnail (bilinear, edges clamped) on a
/// resolution × resolution grid laid over the hypothesised region and correlates the samples with the content
/// thumbnail at the same resolution. The grid maps to container thumbnail coordinates by one affine map, worked out
/// once per hypothesis. This is the sweep's hot loop.
/// </summary>
internal static class RegionSampler
{
    private const int Side = GreyThumbnail.Side;

    /// <param name="container">Container thumbnail as 32 × 32 floats.</param>
    /// <param name="containerWidth">Container photo width in pixels (the thumbnail squeezes it).</param>
    /// <param name="containerHeight">Container photo height in pixels.</param>
    /// <param name="contentAspect">Content photo width over height.</param>
    /// <param name="template">Content thumbnail at <paramref name="resolution"/>², standardised (zero mean, unit
    /// length; see <see cref="ThumbnailCorrelation.Standardise"/>).</param>
    /// <param name="resolution">Grid side: 16 for the coarse search, 32 for the final score.</param>
    /// <param name="h">The hypothesis.</param>
    public static float Score(
        ReadOnlySpan<float> container,
        int containerWidth,
        int containerHeight,
        double contentAspect,
        ReadOnlySpan<float> template,
        int resolution,
        in AlignmentHypothesis h)
    {
        var map = Map(containerWidth, containerHeight, contentAspect, resolution, h, Side);
        double sum = 0, sumSquares = 0, cross = 0;
        for (var j = 0; j < resolution; j++)
        {
            var tx = map.X0 + (map.Xj * j);
            var ty = map.Y0 + (map.Yj * j);
            var row = template.Slice(j * resolution, resolution);
            float rowSum = 0, rowSquares = 0, rowCross = 0;
            for (var i = 0; i < resolution; i++)
            {
                var s = Bilinear(container, tx, ty, Side);
                rowSum += s;
                rowSquares += s * s;
                rowCross += s * row[i];
                tx += map.Xi;
                ty += map.Yi;
            }

            sum += rowSum;
            sumSquares += rowSquares;
            cross += rowCross;
        }

        var n = resolution * resolution;
        var spread = sumSquares - (sum * sum / n);
        return spread <= 1e-6 * n ? 0f : (float)(cross / Math.Sqrt(spread));
    }

    /// <summary>Writes the container samples of hypothesis <paramref name="h"/> into <paramref name="samples"/>.</summary>
    /// <param name="container">Container picture, <paramref name="side"/> × <paramref name="side"/> floats.</param>
    /// <param name="containerWidth">Container photo width in pixels.</param>
    /// <param name="containerHeight">Container photo height in pixels.</param>
    /// <param name="contentAspect">Content photo width over height.</param>
    /// <param name="resolution">Grid side.</param>
    /// <param name="h">The hypothesis.</param>
    /// <param name="samples">resolution² samples, row by row.</param>
    /// <param name="side">Side of the container picture (32 for a <see cref="GreyThumbnail"/>, 64 for a
    /// <see cref="DetailThumbnail"/>).</param>
    public static void Sample(
        ReadOnlySpan<float> container,
        int containerWidth,
        int containerHeight,
        double contentAspect,
        int resolution,
        in AlignmentHypothesis h,
        Span<float> samples,
        int side = Side)
    {
        var map = Map(containerWidth, containerHeight, contentAspect, resolution, h, side);
        for (var j = 0; j < resolution; j++)
        {
            var tx = map.X0 + (map.Xj * j);
            var ty = map.Y0 + (map.Yj * j);
            for (var i = 0; i < resolution; i++)
            {
                samples[(j * resolution) + i] = Bilinear(container, tx, ty, side);
                tx += map.Xi;
                ty += map.Yi;
            }
        }
    }

    private static float Bilinear(ReadOnlySpan<float> picture, float x, float y, int side)
    {
        x = Math.Clamp(x, 0f, side - 1);
        y = Math.Clamp(y, 0f, side - 1);
        var x0 = Math.Min((int)x, side - 2);
        var y0 = Math.Min((int)y, side - 2);
        var fx = x - x0;
        var fy = y - y0;
        var i = (y0 * side) + x0;
        var top = picture[i] + (fx * (picture[i + 1] - picture[i]));
        var bottom = picture[i + side] + (fx * (picture[i + side + 1] - picture[i + side]));
        return top + (fy * (bottom - top));
    }

    /// <summary>
    /// Grid cell (i, j) of the content maps to container thumbnail coordinates
    /// (X0 + Xi·i + Xj·j, Y0 + Yi·i + Yj·j). Worked in container pixels so a turn stays a turn on a non-square photo.
    /// </summary>
    private static (float X0, float Xi, float Xj, float Y0, float Yi, float Yj) Map(
        int width, int height, double contentAspect, int resolution, in AlignmentHypothesis h, int side)
    {
        var fitWidth = Math.Min(width, contentAspect * height);
        var regionWidth = h.Scale * fitWidth;
        var regionHeight = regionWidth / contentAspect;
        var angle = h.AngleDegrees * Math.PI / 180;
        var (sin, cos) = Math.SinCos(angle);
        var m = h.Mirrored ? -1.0 : 1.0;
        var toX = (double)side / width;
        var toY = (double)side / height;

        var stepX = m * regionWidth / resolution;
        var stepY = regionHeight / resolution;
        var lx0 = m * ((0.5 / resolution) - 0.5) * regionWidth;
        var ly0 = ((0.5 / resolution) - 0.5) * regionHeight;
        var cx = h.CentreX * width;
        var cy = h.CentreY * height;

        return (
            X0: (float)(((cx + (lx0 * cos) - (ly0 * sin)) * toX) - 0.5),
            Xi: (float)(stepX * cos * toX),
            Xj: (float)(-stepY * sin * toX),
            Y0: (float)(((cy + (lx0 * sin) + (ly0 * cos)) * toY) - 0.5),
            Yi: (float)(stepX * sin * toY),
            Yj: (float)(stepY * cos * toY));
    }
}

using System.Numerics.Tensors;

namespace Lookup.Sweeps;

/// <summary>
/// The coarse stage of the crop search as template matching: for each scale the container thumbnail is resampled
/// once so that one content template pixel (16 × 16 template) is one grid pixel, and the template slides over that
/// grid at whole-pixel offsets, window sums coming from integral images. Far cheaper than sampling every placement
/// afresh; unturned and unmirrored placements only (the refinement adds turns). Holds scratch buffers: one instance
/// per thread.
/// </summary>
internal sealed class CoarseGrid
{
    private const int Template = 16;
    private const int MaxGrid = 4 * GreyThumbnail.Side;
    private const int MaxStepsPerAxis = 12;

    private readonly float[] _grid = new float[MaxGrid * MaxGrid];
    private readonly double[] _sum = new double[(MaxGrid + 1) * (MaxGrid + 1)];
    private readonly double[] _squares = new double[(MaxGrid + 1) * (MaxGrid + 1)];

    /// <summary>Fills <paramref name="best"/> with the best placements found; returns how many.</summary>
    /// <param name="container">Container thumbnail as 32 × 32 floats.</param>
    /// <param name="template">Content at 16 × 16, standardised.</param>
    /// <param name="space">The search bounds.</param>
    /// <param name="best">Room for the best few.</param>
    public int Search(ReadOnlySpan<float> container, ReadOnlySpan<float> template, in SearchSpace space, Span<(float Score, AlignmentHypothesis H)> best)
    {
        var count = 0;
        for (var scale = 1f; scale >= space.MinScale - 1e-4f; scale = NextScale(scale, space.MinScale))
        {
            var (halfWidth, halfHeight) = space.HalfExtent(scale);
            var stepX = 2 * halfWidth / Template;
            var stepY = 2 * halfHeight / Template;
            var columns = Math.Min(MaxGrid, (int)((1 / stepX) + 1e-4f));
            var rows = Math.Min(MaxGrid, (int)((1 / stepY) + 1e-4f));
            if (columns < Template || rows < Template)
            {
                continue;
            }

            Resample(container, columns, rows, stepX, stepY);
            Integrate(columns, rows);
            var strideX = Stride(columns - Template + 1);
            var strideY = Stride(rows - Template + 1);
            for (var top = 0; top + Template <= rows; top += strideY)
            {
                for (var left = 0; left + Template <= columns; left += strideX)
                {
                    var score = Correlate(template, columns, left, top);
                    var h = new AlignmentHypothesis(
                        (left + (Template / 2f)) * stepX, (top + (Template / 2f)) * stepY, scale, 0f, false);
                    count = KeepBest(best, count, score, h);
                }
            }
        }

        return count;
    }

    private static int Stride(int positions) => Math.Max(1, (positions + MaxStepsPerAxis - 1) / MaxStepsPerAxis);

    private static float NextScale(float scale, float minScale) =>
        scale > minScale && scale - 0.1f < minScale ? minScale : scale - 0.1f;

    /// <summary>Grid pixel (u, v) is the container sampled at (u + ½, v + ½) steps, bilinear.</summary>
    private void Resample(ReadOnlySpan<float> container, int columns, int rows, float stepX, float stepY)
    {
        const int side = GreyThumbnail.Side;
        for (var v = 0; v < rows; v++)
        {
            var y = Math.Clamp(((v + 0.5f) * stepY * side) - 0.5f, 0f, side - 1);
            var y0 = Math.Min((int)y, side - 2);
            var fy = y - y0;
            for (var u = 0; u < columns; u++)
            {
                var x = Math.Clamp(((u + 0.5f) * stepX * side) - 0.5f, 0f, side - 1);
                var x0 = Math.Min((int)x, side - 2);
                var fx = x - x0;
                var i = (y0 * side) + x0;
                var top = container[i] + (fx * (container[i + 1] - container[i]));
                var bottom = container[i + side] + (fx * (container[i + side + 1] - container[i + side]));
                _grid[(v * columns) + u] = top + (fy * (bottom - top));
            }
        }
    }

    /// <summary>Summed-area tables of the grid and of its squares, (columns + 1) wide with a zero first row and column.</summary>
    private void Integrate(int columns, int rows)
    {
        var width = columns + 1;
        Array.Clear(_sum, 0, width);
        Array.Clear(_squares, 0, width);
        for (var v = 0; v < rows; v++)
        {
            double rowSum = 0, rowSquares = 0;
            _sum[(v + 1) * width] = 0;
            _squares[(v + 1) * width] = 0;
            for (var u = 0; u < columns; u++)
            {
                var g = _grid[(v * columns) + u];
                rowSum += g;
                rowSquares += g * g;
                _sum[((v + 1) * width) + u + 1] = _sum[(v * width) + u + 1] + rowSum;
                _squares[((v + 1) * width) + u + 1] = _squares[(v * width) + u + 1] + rowSquares;
            }
        }
    }

    private float Correlate(ReadOnlySpan<float> template, int columns, int left, int top)
    {
        var cross = 0f;
        for (var j = 0; j < Template; j++)
        {
            cross += TensorPrimitives.Dot(template.Slice(j * Template, Template), _grid.AsSpan(((top + j) * columns) + left, Template));
        }

        var width = columns + 1;
        var sum = Window(_sum, width, left, top);
        var squares = Window(_squares, width, left, top);
        const int n = Template * Template;
        var spread = squares - (sum * sum / n);
        return spread <= 1e-6 * n ? 0f : (float)(cross / Math.Sqrt(spread));
    }

    private static double Window(double[] table, int width, int left, int top) =>
        table[((top + Template) * width) + left + Template] - table[(top * width) + left + Template]
        - table[((top + Template) * width) + left] + table[(top * width) + left];

    private static int KeepBest(Span<(float Score, AlignmentHypothesis H)> best, int count, float score, in AlignmentHypothesis h)
    {
        if (count < best.Length)
        {
            best[count] = (score, h);
            return count + 1;
        }

        var worst = 0;
        for (var i = 1; i < count; i++)
        {
            if (best[i].Score < best[worst].Score)
            {
                worst = i;
            }
        }

        if (score > best[worst].Score)
        {
            best[worst] = (score, h);
        }

        return count;
    }
}

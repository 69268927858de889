namespace Lookup.Sweeps;

/// <summary>
/// Looks for the best placement of one photo's content inside another's frame (crop, resize, small turn, mirror)
/// by correlating their 32 × 32 grey thumbnails: a coarse grid of crops at 16 × 16 (<see cref="CoarseGrid"/>), then coordinate descent from the
/// best few, polished and scored at 32 × 32. The bigger photo (in pixels) is taken as the container, both ways round
/// when the two are about the same size. Holds scratch buffers: one instance per thread.
/// </summary>
internal sealed class ThumbnailAligner
{
    private const int Fine = GreyThumbnail.Side;
    private const int Coarse = Fine / 2;
    private const int Starts = 2;

    private readonly float[] _first = new float[GreyThumbnail.Length];
    private readonly float[] _second = new float[GreyThumbnail.Length];
    private readonly float[] _standardFirst = new float[GreyThumbnail.Length];
    private readonly float[] _standardSecond = new float[GreyThumbnail.Length];
    private readonly float[] _mirrored = new float[GreyThumbnail.Length];
    private readonly float[] _template16 = new float[Coarse * Coarse];
    private readonly float[] _half = new float[Coarse * Coarse];
    private readonly CoarseGrid _coarse = new();
    private readonly float[] _matched = new float[GreyThumbnail.Length];
    private readonly float[] _shrinkScratch = new float[GreyThumbnail.Length];

    /// <summary>
    /// Correlation of the two whole frames, as they are and with <paramref name="b"/> mirrored. Meaningful when the
    /// two photos have about the same aspect ratio (each thumbnail squeezes its photo to a square).
    /// </summary>
    public (float Plain, float Mirrored) FullFrame(GreyThumbnail a, GreyThumbnail b)
    {
        ThumbnailCorrelation.ToFloats(a.Pixels, _first);
        ThumbnailCorrelation.ToFloats(b.Pixels, _second);
        if (!ThumbnailCorrelation.Standardise(_first, _standardFirst) ||
            !ThumbnailCorrelation.Standardise(_second, _standardSecond))
        {
            return (0f, 0f);
        }

        ThumbnailCorrelation.MirrorRows(_standardSecond, _mirrored, Fine);
        return (
            System.Numerics.Tensors.TensorPrimitives.Dot(_standardFirst, _standardSecond),
            System.Numerics.Tensors.TensorPrimitives.Dot(_standardFirst, _mirrored));
    }

    /// <summary>The best placement of either photo's content in the other's frame within <paramref name="limits"/>.</summary>
    public AlignmentResult Search(in PhotoShape a, GreyThumbnail thumbA, in PhotoShape b, GreyThumbnail thumbB, in AlignmentLimits limits)
    {
        var best = AlignmentResult.None;
        var ratio = a.Area / b.Area;
        if (ratio >= 1 / 1.25)
        {
            best = Better(best, SearchInside(a, thumbA, b, thumbB, limits, containerIsA: true));
        }

        if (ratio <= 1.25)
        {
            best = Better(best, SearchInside(b, thumbB, a, thumbA, limits, containerIsA: false));
        }

        return best;
    }

    private static AlignmentResult Better(AlignmentResult x, AlignmentResult y) => y.Correlation > x.Correlation ? y : x;

    private AlignmentResult SearchInside(
        in PhotoShape container, GreyThumbnail containerThumb, in PhotoShape content, GreyThumbnail contentThumb,
        in AlignmentLimits limits, bool containerIsA)
    {
        var space = SpaceFor(container, content, limits);
        if (space.MinScaleAt(limits.MaxAngleDegrees) > 1f)
        {
            return AlignmentResult.None;
        }

        ThumbnailCorrelation.ToFloats(containerThumb.Pixels, _first);
        ThumbnailCorrelation.ToFloats(contentThumb.Pixels, _second);
        ThumbnailCorrelation.Halve(_second, _half, Fine);
        if (!ThumbnailCorrelation.Standardise(_second, _standardSecond) ||
            !ThumbnailCorrelation.Standardise(_half, _template16))
        {
            return AlignmentResult.None;
        }

        Span<(float Score, AlignmentHypothesis H)> starts = stackalloc (float, AlignmentHypothesis)[Starts + 1];
        var count = _coarse.Search(_first, _template16, space, starts[..Starts]);
        if (Math.Abs(Math.Log(container.Aspect / content.Aspect)) < 0.05)
        {
            var mirrored = AlignmentHypothesis.FullFrame with { Mirrored = true };
            starts[count++] = (Score(space, _template16, Coarse, mirrored), mirrored);
        }

        var result = AlignmentResult.None;
        foreach (var (score, start) in starts[..count])
        {
            if (score < limits.CoarseFloor)
            {
                continue;
            }

            var coarseScore = score;
            var h = Refine(space, _template16, Coarse, start, ref coarseScore, 1f / 32, 0.04f, 2f, 1f / 128);
            var (template, resolution) = MatchedTemplate(space, h.Scale);
            var fineScore = Score(space, template, resolution, h);
            h = Refine(space, template, resolution, h, ref fineScore, 1f / 128, 0.005f, 0.5f, 1f / 256);
            result = Better(result, new AlignmentResult(fineScore, h, containerIsA));
        }

        return result;
    }

    /// <summary>
    /// The content template at the resolution of its region in the container thumbnail (16 to 32 samples a side):
    /// a crop's region spans fewer than 32 container pixels, and comparing it with the content's full 32 × 32 would
    /// count the detail the container thumbnail never had as disagreement.
    /// </summary>
    private (float[] Template, int Resolution) MatchedTemplate(in SearchSpace space, float scale)
    {
        var (halfWidth, halfHeight) = space.HalfExtent(scale);
        var span = 2 * Math.Min(halfWidth, halfHeight) * Fine;
        var resolution = Math.Clamp((int)MathF.Round(span), Coarse, Fine);
        if (resolution == Fine)
        {
            return (_standardSecond, Fine);
        }

        var length = resolution * resolution;
        ThumbnailCorrelation.Shrink(_second, _matched, resolution, _shrinkScratch);
        ThumbnailCorrelation.Standardise(_matched.AsSpan(0, length), _matched.AsSpan(0, length));
        return (_matched, resolution);
    }

    /// <summary>
    /// Without enlargement, the content's region in the container holds at least as many pixels as the content has,
    /// which bounds the scale from below (see <see cref="SearchSpace.MinScaleAt"/>).
    /// </summary>
    private static SearchSpace SpaceFor(in PhotoShape container, in PhotoShape content, in AlignmentLimits limits)
    {
        var fitWidth = Math.Min(container.Width, content.Aspect * container.Height);
        var noUpscale = limits.CropsMayBeUpscaled ? 0f : (float)(content.Width / fitWidth);
        return new SearchSpace(
            container.Width, container.Height, content.Aspect, limits.MinCropScale, noUpscale, limits.MaxAngleDegrees,
            limits.UpscaleSlack);
    }

    /// <summary>
    /// Coordinate descent: try each parameter one step either way, keep the first gain, halve the steps when none
    /// helps, stop when the centre step falls below <paramref name="minStep"/>.
    /// </summary>
    private AlignmentHypothesis Refine(
        in SearchSpace space, float[] template, int resolution, AlignmentHypothesis h, ref float score,
        float centreStep, float scaleStep, float angleStep, float minStep)
    {
        const int maxEvaluations = 64;
        var evaluations = 0;
        while (centreStep >= minStep && evaluations < maxEvaluations)
        {
            var improved = false;
            for (var move = 0; move < 8 && !improved; move++)
            {
                var sign = (move & 1) == 0 ? 1f : -1f;
                var candidate = (move >> 1) switch
                {
                    0 => h with { CentreX = h.CentreX + (sign * centreStep) },
                    1 => h with { CentreY = h.CentreY + (sign * centreStep) },
                    2 => h with { Scale = h.Scale + (sign * scaleStep) },
                    _ => h with { AngleDegrees = h.AngleDegrees + (sign * angleStep) },
                };
                if (!space.Contains(candidate))
                {
                    continue;
                }

                var s = Score(space, template, resolution, candidate);
                evaluations++;
                if (s > score + 1e-4f)
                {
                    (h, score, improved) = (candidate, s, true);
                }
            }

            if (!improved)
            {
                centreStep /= 2;
                scaleStep /= 2;
                angleStep /= 2;
            }
        }

        return h;
    }

    private float Score(in SearchSpace space, float[] template, int resolution, in AlignmentHypothesis h) =>
        RegionSampler.Score(_first, space.Width, space.Height, space.ContentAspect, template, resolution, h);
}

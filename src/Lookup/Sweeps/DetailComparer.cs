namespace Lookup.Sweeps;

/// <summary>
/// Checks a placement the 32 × 32 search found on the two photos' 64 × 64 <see cref="DetailThumbnail"/>s: samples the
/// container's region under the hypothesis, brings the content to the same resolution, and correlates their
/// gradients (horizontal and vertical differences of neighbouring samples). Gradients ignore a change of brightness,
/// and the normalised correlation a change of contrast, so a re-saved, resized, mirrored, cropped or straightened copy
/// scores close to 1; two renders or shots of look-alike parts in one pose share the outline (which carries the
/// 32 × 32 correlation) but not where their edges fall at twice the resolution, and score far lower. Holds scratch
/// buffers: one instance per thread.
/// </summary>
internal sealed class DetailComparer
{
    private const int Side = DetailThumbnail.Side;
    private const int MinResolution = Side / 2;

    private readonly float[] _container = new float[DetailThumbnail.Length];
    private readonly float[] _content = new float[DetailThumbnail.Length];
    private readonly float[] _template = new float[DetailThumbnail.Length];
    private readonly float[] _samples = new float[DetailThumbnail.Length];
    private readonly SquareShrinker _shrinker = new(Side);
    private readonly float[] _templateGradient = new float[2 * DetailThumbnail.Length];
    private readonly float[] _sampleGradient = new float[2 * DetailThumbnail.Length];

    /// <summary>
    /// Gradient correlation of <paramref name="content"/> with the region of <paramref name="container"/> under
    /// <paramref name="h"/>, after a short local search (a step of a quarter detail pixel, a quarter of a degree) that
    /// absorbs the 32 × 32 search's rounding. 1 is the same picture; 0 unrelated; 0 for a flat picture.
    /// </summary>
    public float Correlate(
        DetailThumbnail container, in PhotoShape containerShape, DetailThumbnail content, in PhotoShape contentShape,
        in AlignmentHypothesis h, int rounds = 12)
    {
        ThumbnailCorrelation.ToFloats(container.Pixels, _container);
        ThumbnailCorrelation.ToFloats(content.Pixels, _content);
        var resolution = Resolution(containerShape, contentShape, h.Scale);
        var length = 2 * resolution * (resolution - 1);
        _shrinker.Shrink(_content, _template, resolution);
        Gradient(_template, resolution, _templateGradient);
        if (!ThumbnailCorrelation.Standardise(_templateGradient.AsSpan(0, length), _templateGradient.AsSpan(0, length)))
        {
            return 0f;
        }

        var best = Score(containerShape, contentShape.Aspect, resolution, h);
        var current = h;
        var (centreStep, angleStep, scaleStep) = (0.25f / Side, 0.25f, 0.25f / Side);
        for (var round = 0; round < rounds; round++)
        {
            var improved = false;
            for (var move = 0; move < 8; move++)
            {
                var sign = (move & 1) == 0 ? 1f : -1f;
                var candidate = (move >> 1) switch
                {
                    0 => current with { CentreX = current.CentreX + (sign * centreStep) },
                    1 => current with { CentreY = current.CentreY + (sign * centreStep) },
                    2 => current with { Scale = Math.Min(1f, current.Scale + (sign * scaleStep)) },
                    _ => current with { AngleDegrees = current.AngleDegrees + (sign * angleStep) },
                };
                var s = Score(containerShape, contentShape.Aspect, resolution, candidate);
                if (s > best + 1e-4f)
                {
                    (current, best, improved) = (candidate, s, true);
                }
            }

            if (!improved)
            {
                break;
            }
        }

        return best;
    }

    private float Score(in PhotoShape containerShape, double contentAspect, int resolution, in AlignmentHypothesis h)
    {
        var length = 2 * resolution * (resolution - 1);
        RegionSampler.Sample(_container, containerShape.Width, containerShape.Height, contentAspect, resolution, h, _samples, Side);
        Gradient(_samples, resolution, _sampleGradient);
        var samples = _sampleGradient.AsSpan(0, length);
        return ThumbnailCorrelation.Standardise(samples, samples)
            ? System.Numerics.Tensors.TensorPrimitives.Dot(samples, _templateGradient.AsSpan(0, length))
            : 0f;
    }

    /// <summary>
    /// The region's size in container detail pixels (its shorter side), 32 to 64: a crop's region spans fewer than 64
    /// container pixels, and comparing it with the content's full 64 × 64 would count detail the container never had.
    /// </summary>
    private static int Resolution(in PhotoShape container, in PhotoShape content, float scale)
    {
        var fitWidth = Math.Min(container.Width, content.Aspect * container.Height);
        var fitHeight = fitWidth / content.Aspect;
        var span = Math.Min(scale * fitWidth / container.Width, scale * fitHeight / container.Height) * Side;
        return Math.Clamp((int)Math.Round(span), MinResolution, Side);
    }

    /// <summary>Horizontal differences (side − 1 per row) then vertical differences (side − 1 per column).</summary>
    private static void Gradient(ReadOnlySpan<float> pixels, int side, Span<float> target)
    {
        var k = 0;
        for (var y = 0; y < side; y++)
        {
            for (var x = 0; x + 1 < side; x++)
            {
                target[k++] = pixels[(y * side) + x + 1] - pixels[(y * side) + x];
            }
        }

        for (var y = 0; y + 1 < side; y++)
        {
            for (var x = 0; x < side; x++)
            {
                target[k++] = pixels[((y + 1) * side) + x] - pixels[(y * side) + x];
            }
        }
    }
}

namespace Lookup.Sweeps;

/// <summary>
/// Compares the colour of two photos under a placement the 32 × 32 search found: the container's Cb and Cr samples
/// over the region against the content's planes at the same resolution. Each plane's mean is removed (a global
/// white-balance shift moves every pixel's chroma about alike), then the two are compared by their spread (how much
/// colour varies across the picture, in grey levels) and by the normalised correlation of their patterns. Holds
/// scratch buffers: one instance per thread.
/// </summary>
internal sealed class ChromaComparer
{
    private const int Side = ChromaThumbnail.Side;

    private readonly float[] _container = new float[ChromaThumbnail.PlaneLength];
    private readonly float[] _content = new float[ChromaThumbnail.PlaneLength];
    private readonly float[] _samples = new float[ChromaThumbnail.Length];
    private readonly float[] _template = new float[ChromaThumbnail.Length];
    private readonly SquareShrinker _shrinker = new(Side);

    /// <summary>
    /// The colour spread (root mean square of the mean-removed Cb and Cr, in levels) of the content and of the
    /// container region, and the correlation of the two patterns (0 when either has no spread).
    /// </summary>
    public (float ContentSpread, float ContainerSpread, float Correlation) Compare(
        ChromaThumbnail container, in PhotoShape containerShape, ChromaThumbnail content, in PhotoShape contentShape,
        in AlignmentHypothesis h)
    {
        var resolution = Resolution(containerShape, contentShape, h.Scale);
        var n = resolution * resolution;
        for (var plane = 0; plane < 2; plane++)
        {
            ThumbnailCorrelation.ToFloats(plane == 0 ? container.Cb : container.Cr, _container);
            ThumbnailCorrelation.ToFloats(plane == 0 ? content.Cb : content.Cr, _content);
            RegionSampler.Sample(_container, containerShape.Width, containerShape.Height, contentShape.Aspect, resolution, h,
                _samples.AsSpan(plane * n, n), Side);
            _shrinker.Shrink(_content, _template.AsSpan(plane * n, n), resolution);
            RemoveMean(_samples.AsSpan(plane * n, n));
            RemoveMean(_template.AsSpan(plane * n, n));
        }

        var samples = _samples.AsSpan(0, 2 * n);
        var template = _template.AsSpan(0, 2 * n);
        var sampleNorm = System.Numerics.Tensors.TensorPrimitives.Norm(samples);
        var templateNorm = System.Numerics.Tensors.TensorPrimitives.Norm(template);
        var spread = MathF.Sqrt(2 * n);
        var correlation = sampleNorm > 1e-3f && templateNorm > 1e-3f
            ? System.Numerics.Tensors.TensorPrimitives.Dot(samples, template) / (sampleNorm * templateNorm)
            : 0f;
        return (templateNorm / spread, sampleNorm / spread, correlation);
    }

    private static void RemoveMean(Span<float> values)
    {
        var mean = System.Numerics.Tensors.TensorPrimitives.Sum(values) / values.Length;
        System.Numerics.Tensors.TensorPrimitives.Subtract(values, mean, values);
    }

    /// <summary>The region's shorter side in container chroma pixels, 16 to 32 (see <see cref="DetailComparer"/>).</summary>
    private static int Resolution(in PhotoShape container, in PhotoShape content, float scale)
    {
        var fitWidth = Math.Min(container.Width, content.Aspect * container.Height);
        var fitHeight = fitWidth / content.Aspect;
        var span = Math.Min(scale * fitWidth / container.Width, scale * fitHeight / container.Height) * Side;
        return Math.Clamp((int)Math.Round(span), Side / 2, Side);
    }
}

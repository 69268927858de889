namespace Lookup.Sweeps;

/// <summary>
/// Area-averages a square float picture of a fixed side down to a smaller square, reusing its buffers and the area
/// weights per target resolution (the detail and colour comparers shrink the same content to many resolutions).
/// Thread safety: none; one per comparer.
/// </summary>
internal sealed class SquareShrinker(int side)
{
    private readonly float[] _narrow = new float[side * side];
    private readonly AreaWeights?[] _weights = new AreaWeights?[side + 1];

    /// <summary>Shrinks the side × side <paramref name="pixels"/> into <paramref name="target"/> (resolution²; a copy at the full side).</summary>
    public void Shrink(ReadOnlySpan<float> pixels, Span<float> target, int resolution)
    {
        if (resolution == side)
        {
            pixels.CopyTo(target);
            return;
        }

        var weights = _weights[resolution] ??= AreaWeights.For(side, resolution);
        for (var y = 0; y < side; y++)
        {
            weights.Apply(pixels.Slice(y * side, side), _narrow.AsSpan(y * resolution, resolution));
        }

        Span<float> column = stackalloc float[side];
        Span<float> shrunk = stackalloc float[side];
        for (var x = 0; x < resolution; x++)
        {
            for (var y = 0; y < side; y++)
            {
                column[y] = _narrow[(y * resolution) + x];
            }

            weights.Apply(column, shrunk[..resolution]);
            for (var y = 0; y < resolution; y++)
            {
                target[(y * resolution) + x] = shrunk[y];
            }
        }
    }
}

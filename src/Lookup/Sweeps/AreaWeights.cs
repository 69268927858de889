namespace Lookup.Sweeps;

/// <summary>
/// Area-averaging weights for shrinking one axis of <c>source</c> samples to <c>target</c> samples: target sample
/// <c>t</c> covers source interval [t·s, (t+1)·s) with s = source / target, and each source sample contributes the
/// share of it that lies inside.
/// </summary>
internal sealed class AreaWeights
{
    private readonly int[] _first;
    private readonly int[] _count;
    private readonly int[] _offset;
    private readonly float[] _weights;

    private AreaWeights(int[] first, int[] count, int[] offset, float[] weights)
    {
        _first = first;
        _count = count;
        _offset = offset;
        _weights = weights;
    }

    public static AreaWeights For(int source, int target)
    {
        var scale = (double)source / target;
        var first = new int[target];
        var count = new int[target];
        var offset = new int[target];
        var weights = new List<float>();
        for (var t = 0; t < target; t++)
        {
            var start = t * scale;
            var end = (t + 1) * scale;
            var lo = Math.Min((int)Math.Floor(start), source - 1);
            var hi = Math.Max(lo + 1, Math.Min((int)Math.Ceiling(end), source));
            first[t] = lo;
            count[t] = hi - lo;
            offset[t] = weights.Count;
            var total = end - start;
            for (var s = lo; s < hi; s++)
            {
                var covered = Math.Min(end, s + 1) - Math.Max(start, s);
                weights.Add((float)(Math.Max(covered, 0) / total));
            }

            // Stretching: a target sample takes the source sample under its centre whole.
            if (scale < 1)
            {
                weights.RemoveRange(offset[t], count[t]);
                weights.Add(1f);
                first[t] = Math.Min((int)((t + 0.5) * scale), source - 1);
                count[t] = 1;
            }
        }

        return new AreaWeights(first, count, offset, [.. weights]);
    }

    public void Apply(ReadOnlySpan<byte> source, Span<float> target)
    {
        for (var t = 0; t < target.Length; t++)
        {
            var sum = 0f;
            var w = _weights.AsSpan(_offset[t], _count[t]);
            var s = source.Slice(_first[t], _count[t]);
            for (var i = 0; i < w.Length; i++)
            {
                sum += w[i] * s[i];
            }

            target[t] = sum;
        }
    }

    public void Apply(ReadOnlySpan<float> source, Span<float> target)
    {
        for (var t = 0; t < target.Length; t++)
        {
            var sum = 0f;
            var w = _weights.AsSpan(_offset[t], _count[t]);
            var s = source.Slice(_first[t], _count[t]);
            for (var i = 0; i < w.Length; i++)
            {
                sum += w[i] * s[i];
            }

            target[t] = sum;
        }
    }
}

namespace Lookup.Calibration;

/// <summary>Limits and shares read off distances sorted in ascending order.</summary>
internal static class DistanceQuantiles
{
    /// <summary>
    /// The largest limit that keeps at most <paramref name="rate"/> of <paramref name="sorted"/> at or below it:
    /// with k = ⌊rate · n⌋, halfway between the k-th and (k+1)-th smallest distance; just below the smallest when
    /// k = 0 (the sample is then too small to show the rate, and the limit keeps every pair out).
    /// </summary>
    public static float LimitAtRate(ReadOnlySpan<float> sorted, double rate)
    {
        if (sorted.IsEmpty)
        {
            return float.PositiveInfinity;
        }

        int k = (int)Math.Floor((rate * sorted.Length) + 1e-9);
        if (k >= sorted.Length)
        {
            return sorted[^1];
        }

        return k == 0 ? MathF.BitDecrement(sorted[0]) : (sorted[k - 1] + sorted[k]) / 2;
    }

    /// <summary>The smallest distance that has at least <paramref name="coverage"/> of <paramref name="sorted"/> at or below it.</summary>
    public static float Covering(ReadOnlySpan<float> sorted, double coverage)
    {
        if (sorted.IsEmpty)
        {
            return float.PositiveInfinity;
        }

        int index = (int)Math.Ceiling((coverage * sorted.Length) - 1e-9) - 1;
        return sorted[Math.Clamp(index, 0, sorted.Length - 1)];
    }

    /// <summary>How many of <paramref name="sorted"/> are at or below <paramref name="limit"/>.</summary>
    public static int CountAtOrBelow(ReadOnlySpan<float> sorted, float limit)
    {
        int low = 0;
        int high = sorted.Length;
        while (low < high)
        {
            int middle = (low + high) >>> 1;
            if (sorted[middle] <= limit)
            {
                low = middle + 1;
            }
            else
            {
                high = middle;
            }
        }

        return low;
    }

    /// <summary>The median of <paramref name="sorted"/>, NaN when empty.</summary>
    public static float Median(ReadOnlySpan<float> sorted) => sorted.IsEmpty
        ? float.NaN
        : sorted.Length % 2 == 1 ? sorted[sorted.Length / 2] : (sorted[(sorted.Length / 2) - 1] + sorted[sorted.Length / 2]) / 2;
}

namespace Lookup.Calibration;

/// <summary>
/// Counts of copy, sibling and stranger distances in bins of <see cref="BinWidth"/> from 0 up to 2 (the cosine
/// distance range); the last bin also holds anything beyond. Kept in the index so reports can draw them later.
/// </summary>
/// <param name="BinWidth">Width of one bin in cosine distance.</param>
/// <param name="Copies">Copies to their originals, per bin.</param>
/// <param name="Siblings">Different photos of one SKU, per bin.</param>
/// <param name="Strangers">Photos of different SKUs, per bin.</param>
public sealed record DistanceHistograms(float BinWidth, int[] Copies, int[] Siblings, int[] Strangers)
{
    /// <summary>Bin width used by calibrate.</summary>
    public const float DefaultBinWidth = 0.01f;

    /// <summary>Number of bins.</summary>
    public int BinCount => Copies.Length;

    /// <summary>The upper edge of the last bin holding anything, or 0 when all are empty.</summary>
    public float HighestDistance
    {
        get
        {
            for (int bin = BinCount - 1; bin >= 0; bin--)
            {
                if (Copies[bin] + Siblings[bin] + Strangers[bin] > 0)
                {
                    return (bin + 1) * BinWidth;
                }
            }

            return 0;
        }
    }

    internal static DistanceHistograms From(IEnumerable<float> copies, IEnumerable<float> siblings, IEnumerable<float> strangers, float binWidth = DefaultBinWidth)
    {
        int bins = (int)MathF.Round(2f / binWidth);
        return new DistanceHistograms(binWidth, Count(copies, bins, binWidth), Count(siblings, bins, binWidth), Count(strangers, bins, binWidth));
    }

    private static int[] Count(IEnumerable<float> distances, int bins, float binWidth)
    {
        var counts = new int[bins];
        foreach (float d in distances)
        {
            counts[Math.Clamp((int)MathF.Floor(d / binWidth), 0, bins - 1)]++;
        }

        return counts;
    }
}

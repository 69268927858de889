namespace Lookup.Calibration;

/// <summary>How many of a measured group fell inside a band, with the share and its 95 % upper bound.</summary>
/// <param name="Inside">Members inside the band.</param>
/// <param name="Total">Members measured.</param>
public readonly record struct RateCount(int Inside, int Total)
{
    /// <summary>Inside / Total; 0 when nothing was measured.</summary>
    public double Rate => Total == 0 ? 0 : (double)Inside / Total;

    /// <summary>
    /// Upper end of the 95 % Wilson score interval (Wilson 1927; common practice for a binomial share, and honest at
    /// zero counts, where the plain share would claim a rate of exactly 0).
    /// </summary>
    public double Upper95
    {
        get
        {
            if (Total == 0)
            {
                return 1;
            }

            const double z = 1.959964;
            double n = Total;
            double p = Rate;
            double centre = p + (z * z / (2 * n));
            double spread = z * Math.Sqrt((p * (1 - p) / n) + (z * z / (4 * n * n)));
            return Math.Min(1, (centre + spread) / (1 + (z * z / n)));
        }
    }
}

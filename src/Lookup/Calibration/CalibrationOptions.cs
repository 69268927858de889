namespace Lookup.Calibration;

/// <summary>How <see cref="Calibrator"/> samples, edits and chooses. Defaults are the ones <c>lookup calibrate</c> uses.</summary>
public sealed record CalibrationOptions
{
    /// <summary>Catalogue photos that get edited copies (each copy costs one embedding). Default 300.</summary>
    public int SampleSize { get; init; } = 300;

    /// <summary>Seed of every random choice: the same index, seed and options give the same thresholds.</summary>
    public int Seed { get; init; } = 1;

    /// <summary>Share of stranger pairs (different SKUs) allowed inside the copy band. Default 0.001 (0.1 %).</summary>
    public double TargetFalseMatchRate { get; init; } = 0.001;

    /// <summary>The same-part band allows this many times the copy band's stranger rate. Default 10 (1 % at the default target).</summary>
    public double SamePartRateFactor { get; init; } = 10;

    /// <summary>The copy band ends where it holds this share of the fitted copies, if strangers allow it to reach that far. Default 0.99.</summary>
    public double CopyCoverage { get; init; } = 0.99;

    /// <summary>At most this many stranger pairs, and as many sibling pairs, are drawn per half. Default 250,000.</summary>
    public int MaxPairsPerHalf { get; init; } = 250_000;

    /// <summary>Threads making and embedding copies (each runs whole photos). Default: one per core.</summary>
    public int Workers { get; init; } = Environment.ProcessorCount;

    /// <summary>Fewest indexed photos with a SKU calibrate accepts. Default 20.</summary>
    public int MinPhotos { get; init; } = 20;

    /// <summary>Fewest SKUs: thresholds are fitted on half of them and measured on the other half, so 4. Default 4.</summary>
    public int MinSkus { get; init; } = 4;

    /// <summary>The copy edits made of each sampled photo; default every kind.</summary>
    public IReadOnlyList<CopyEditKind> Edits { get; init; } = Enum.GetValues<CopyEditKind>();

    /// <summary>The same-part band's stranger rate: <see cref="TargetFalseMatchRate"/> × <see cref="SamePartRateFactor"/>, at most 0.5.</summary>
    public double SamePartFalseMatchRate => Math.Min(0.5, TargetFalseMatchRate * SamePartRateFactor);

    internal void Validate()
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(SampleSize);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(Workers);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(MaxPairsPerHalf);
        ArgumentOutOfRangeException.ThrowIfLessThan(MinPhotos, 2);
        ArgumentOutOfRangeException.ThrowIfLessThan(MinSkus, 4);
        if (!(TargetFalseMatchRate is > 0 and <= 0.1))
        {
            throw new ArgumentOutOfRangeException(nameof(TargetFalseMatchRate), TargetFalseMatchRate, "The target false-match rate must lie in (0, 0.1].");
        }

        if (!(SamePartRateFactor >= 1) || !(CopyCoverage is > 0 and <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(SamePartRateFactor), "The same-part factor must be at least 1 and the copy coverage in (0, 1].");
        }

        if (Edits is null || Edits.Count == 0)
        {
            throw new ArgumentException("At least one copy edit is needed.", nameof(Edits));
        }
    }
}

using Lookup.Store;

namespace Lookup.Calibration;

/// <summary>What one calibration measured and chose. <see cref="Store"/> writes it into the index.</summary>
public sealed record CalibrationResult
{
    /// <summary>The thresholds to store (source "calibrated", with date, sample size, photo count, model and target).</summary>
    public required VerdictThresholds Thresholds { get; init; }

    /// <summary>The chosen limits and what set each.</summary>
    public required ChosenLimits Limits { get; init; }

    /// <summary>The limits measured on the held-out half.</summary>
    public required HeldOutRates Measured { get; init; }

    /// <summary>All measured distances (both halves) in bins, for the plot.</summary>
    public required DistanceHistograms Histograms { get; init; }

    /// <summary>The options used.</summary>
    public required CalibrationOptions Options { get; init; }

    /// <summary>Indexed photos with a SKU.</summary>
    public int Photos { get; init; }

    /// <summary>Distinct SKUs.</summary>
    public int Skus { get; init; }

    /// <summary>SKUs with two or more photos of different content (the source of siblings).</summary>
    public int SkusWithSiblings { get; init; }

    /// <summary>SKUs in the fitting half.</summary>
    public int FitSkus { get; init; }

    /// <summary>SKUs in the held-out half.</summary>
    public int HeldOutSkus { get; init; }

    /// <summary>Photos drawn for copies.</summary>
    public int PhotosSampled { get; init; }

    /// <summary>Copies made and embedded.</summary>
    public int Copies { get; init; }

    /// <summary>Copies of fitting-half photos.</summary>
    public int FitCopies { get; init; }

    /// <summary>Sibling pairs in the fitting half.</summary>
    public int FitSiblingPairs { get; init; }

    /// <summary>Stranger pairs in the fitting half.</summary>
    public int FitStrangerPairs { get; init; }

    /// <summary>Sampled photos that got no copies.</summary>
    public IReadOnlyList<SkippedPhoto> Skipped { get; init; } = [];

    /// <summary>What the reader should know about the figures (small samples, missing siblings, skipped photos).</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];

    /// <summary>Wall time of the run.</summary>
    public TimeSpan Elapsed { get; init; }

    /// <summary>Writes the thresholds and the calibration record (figures and histograms) in one transaction.</summary>
    public void Store(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        file.InTransaction(() =>
        {
            Thresholds.Write(file);
            CalibrationRecord.From(this).Write(file);
        });
    }
}

namespace Lookup.Calibration;

/// <summary>The chosen band limits and what set each, from the fitting half.</summary>
/// <param name="Copy">Upper cosine distance of the copy band.</param>
/// <param name="SamePart">Upper cosine distance of the same-part band (≥ <paramref name="Copy"/>).</param>
/// <param name="CopySetBy">What ended the copy band.</param>
/// <param name="SamePartSetBy">What ended the same-part band.</param>
/// <param name="StrangerLimitAtTarget">Where the fitted strangers reach the copy band's target rate.</param>
/// <param name="StrangerLimitAtSamePartRate">Where they reach the same-part band's rate.</param>
/// <param name="CopyCoverageLimit">Where the fitted copies reach the copy coverage (infinite without copies).</param>
/// <param name="FitStrangerPairs">Stranger pairs in the fitting half.</param>
public sealed record ChosenLimits(
    float Copy,
    float SamePart,
    BandLimit CopySetBy,
    BandLimit SamePartSetBy,
    float StrangerLimitAtTarget,
    float StrangerLimitAtSamePartRate,
    float CopyCoverageLimit,
    int FitStrangerPairs);

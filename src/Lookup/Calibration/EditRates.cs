namespace Lookup.Calibration;

/// <summary>How one kind of copy edit fared on the held-out half.</summary>
/// <param name="Kind">The edit.</param>
/// <param name="InCopyBand">Copies of this kind inside the copy band.</param>
/// <param name="InSamePartBand">Copies of this kind inside the copy or same-part band.</param>
/// <param name="Median">Median distance to the original.</param>
/// <param name="Max">Largest distance to the original.</param>
public sealed record EditRates(CopyEditKind Kind, RateCount InCopyBand, RateCount InSamePartBand, float Median, float Max);

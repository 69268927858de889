namespace Lookup.Calibration;

/// <summary>
/// Chooses the band limits from the fitting half (a Neyman–Pearson style choice: hold the false-match rate, take
/// as much of the rest as that allows):
/// <list type="bullet">
/// <item>Copy: where <see cref="CalibrationOptions.TargetFalseMatchRate"/> of stranger pairs lie at or below, or
/// earlier where <see cref="CalibrationOptions.CopyCoverage"/> of the copies already lie (further would only admit
/// second views and strangers).</item>
/// <item>Same part: where <see cref="CalibrationOptions.SamePartFalseMatchRate"/> of stranger pairs lie at or
/// below, never before the copy band ends. Siblings are measured against it but do not set it: they are studio
/// views, and a clerk's photo of a part lies further from the catalogue than another studio view does.</item>
/// </list>
/// </summary>
internal static class ThresholdChooser
{
    public static ChosenLimits Choose(DistanceSet fit, CalibrationOptions options)
    {
        float strangerCopy = DistanceQuantiles.LimitAtRate(fit.Strangers, options.TargetFalseMatchRate);
        float strangerSame = DistanceQuantiles.LimitAtRate(fit.Strangers, options.SamePartFalseMatchRate);
        float coverage = DistanceQuantiles.Covering(fit.CopyDistances, options.CopyCoverage);

        var (copy, copyBy) = coverage < strangerCopy ? (coverage, BandLimit.CopyCoverage) : (strangerCopy, BandLimit.StrangerRate);
        var (same, sameBy) = strangerSame > copy ? (strangerSame, BandLimit.StrangerRate) : (copy, BandLimit.CopyBand);
        return new ChosenLimits(copy, same, copyBy, sameBy, strangerCopy, strangerSame, coverage, fit.Strangers.Length);
    }
}

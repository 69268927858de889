using System.Globalization;

namespace Lookup.Calibration;

/// <summary>Plain warnings about how far a calibration's figures can be trusted.</summary>
internal static class CalibrationWarnings
{
    /// <summary>Below this many expected pairs inside a band a measured rate is mostly noise (common practice: ~10 events).</summary>
    private const double FewEvents = 10;

    public static IReadOnlyList<string> For(CalibrationResult r, int sampled)
    {
        var o = r.Options;
        var m = r.Measured;
        var warnings = new List<string>();
        if (r.Skipped.Count > 0)
        {
            warnings.Add(F($"{r.Skipped.Count} of {sampled} sampled photos got no copies (missing, changed since ingest or unreadable); they are listed. Run ingest again to bring the index up to date."));
        }

        if (o.TargetFalseMatchRate * r.FitStrangerPairs < 1)
        {
            warnings.Add(F($"The fitting half has {r.FitStrangerPairs:N0} stranger pairs, too few to place a {Percent(o.TargetFalseMatchRate)} limit: the copy band ends just below the closest stranger pair ({r.Limits.StrangerLimitAtTarget:0.000}). More photos and SKUs give a sharper limit."));
        }

        int heldStrangers = m.StrangersInCopyBand.Total;
        if (o.TargetFalseMatchRate * heldStrangers < FewEvents)
        {
            warnings.Add(F($"Only {heldStrangers:N0} held-out stranger pairs: at the target about {o.TargetFalseMatchRate * heldStrangers:0.0} would fall inside the copy band, too few to measure the rate well. The measured {Percent(m.StrangersInCopyBand.Rate)} is rough (95 % upper bound {Percent(m.StrangersInCopyBand.Upper95)})."));
        }
        else if (m.StrangersInCopyBand.Rate > 2 * o.TargetFalseMatchRate)
        {
            warnings.Add(F($"On the held-out half {Percent(m.StrangersInCopyBand.Rate)} of stranger pairs fall inside the copy band, over twice the target {Percent(o.TargetFalseMatchRate)}: the two halves of the catalogue differ. Run again with a larger --sample or another --seed and compare."));
        }

        if (r.SkusWithSiblings == 0)
        {
            warnings.Add("No SKU has two different photos, so siblings (second views of one part) were not measured.");
        }

        if (m.CopiesInCopyBand.Total == 0)
        {
            warnings.Add("No sampled photo fell in the held-out half, so copies were not measured there; use a larger --sample.");
        }
        else if (m.CopiesInCopyBand.Rate < 0.9)
        {
            var hardest = m.ByEdit.OrderBy(e => e.InCopyBand.Rate).First();
            warnings.Add(F($"Only {Percent(m.CopiesInCopyBand.Rate)} of held-out copies fall inside the copy band (hardest: {Words(hardest.Kind)}, {Percent(hardest.InCopyBand.Rate)}): to this model such copies look as much like other photos as like their original. The sweep's pixel checks still find them."));
        }

        if (r.Limits.SamePartSetBy == BandLimit.CopyBand)
        {
            warnings.Add("The same-part band is empty: strangers reach the same-part rate before the copy band ends.");
        }

        return warnings;
    }

    internal static string Percent(double rate) => rate.ToString(rate < 0.01 && rate > 0 ? "0.00 %" : "0.0 %", CultureInfo.InvariantCulture);

    internal static string Words(CopyEditKind kind) => kind switch
    {
        CopyEditKind.Recompress => "JPEG re-saves",
        CopyEditKind.Downscale => "shrunk copies",
        CopyEditKind.Crop => "crops",
        CopyEditKind.Tone => "tone changes",
        CopyEditKind.WhiteBalance => "colour casts",
        CopyEditKind.Mirror => "mirrored copies",
        CopyEditKind.Straighten => "straightened copies",
        _ => "web exports",
    };

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

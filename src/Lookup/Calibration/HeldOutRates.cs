namespace Lookup.Calibration;

/// <summary>
/// The chosen limits measured on the held-out half (SKUs and photos the choice never saw). A band "holds" a pair
/// when its distance is at or below the band's upper limit; the same-part band includes the copy band.
/// </summary>
/// <param name="CopiesInCopyBand">Copies caught by the copy band.</param>
/// <param name="CopiesInSamePartBand">Copies inside the same-part band or closer.</param>
/// <param name="StrangersInCopyBand">Stranger pairs wrongly inside the copy band: the measured false-match rate.</param>
/// <param name="StrangersInSamePartBand">Stranger pairs wrongly inside the same-part band or closer.</param>
/// <param name="SiblingsInCopyBand">Second views of one SKU that the copy band would call copies.</param>
/// <param name="SiblingsInSamePartBand">Second views of one SKU inside the same-part band or closer.</param>
/// <param name="ByEdit">Copies per kind of edit.</param>
public sealed record HeldOutRates(
    RateCount CopiesInCopyBand,
    RateCount CopiesInSamePartBand,
    RateCount StrangersInCopyBand,
    RateCount StrangersInSamePartBand,
    RateCount SiblingsInCopyBand,
    RateCount SiblingsInSamePartBand,
    IReadOnlyList<EditRates> ByEdit)
{
    internal static HeldOutRates Measure(DistanceSet heldOut, ChosenLimits limits)
    {
        RateCount In(float[] sorted, float limit) => new(DistanceQuantiles.CountAtOrBelow(sorted, limit), sorted.Length);

        var byEdit = heldOut.Copies.GroupBy(c => c.Kind).OrderBy(g => g.Key).Select(g =>
        {
            var sorted = g.Select(c => c.Distance).Order().ToArray();
            return new EditRates(g.Key, In(sorted, limits.Copy), In(sorted, limits.SamePart), DistanceQuantiles.Median(sorted), sorted[^1]);
        }).ToList();
        return new HeldOutRates(
            In(heldOut.CopyDistances, limits.Copy),
            In(heldOut.CopyDistances, limits.SamePart),
            In(heldOut.Strangers, limits.Copy),
            In(heldOut.Strangers, limits.SamePart),
            In(heldOut.Siblings, limits.Copy),
            In(heldOut.Siblings, limits.SamePart),
            byEdit);
    }
}

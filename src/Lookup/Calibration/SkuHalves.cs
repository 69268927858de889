namespace Lookup.Calibration;

/// <summary>
/// Splits the SKUs into a fitting half and a held-out half, shuffled by the seed and dealt alternately, so each half
/// has at least two SKUs once there are four. Thresholds are chosen on the fitting half's photos only and measured
/// on the held-out half's, which share no photo and no SKU with them.
/// </summary>
internal static class SkuHalves
{
    /// <summary>For each SKU number, whether it is held out.</summary>
    public static bool[] Split(int skuCount, int seed)
    {
        var order = Enumerable.Range(0, skuCount).ToArray();
        new Random(unchecked(seed + 104_729)).Shuffle(order);
        var heldOut = new bool[skuCount];
        for (int position = 1; position < order.Length; position += 2)
        {
            heldOut[order[position]] = true;
        }

        return heldOut;
    }

    /// <summary>The photos (indices) whose SKU lies in the requested half.</summary>
    public static int[] Members(PhotoGroups groups, bool[] heldOutSku, bool heldOut) =>
        Enumerable.Range(0, groups.Sku.Length).Where(i => heldOutSku[groups.Sku[i]] == heldOut).ToArray();
}

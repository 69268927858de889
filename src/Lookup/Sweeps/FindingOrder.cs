namespace Lookup.Sweeps;

/// <summary>
/// The order findings are reported in: by kind (most severe first), then more photos first, then the closest pair
/// first, then by key so equal findings always come out in the same order.
/// </summary>
internal static class FindingOrder
{
    public static List<SweepFinding> Sort(IEnumerable<SweepFinding> findings) => [.. findings
        .OrderBy(f => f.Kind)
        .ThenByDescending(f => f.Members.Count)
        .ThenBy(Closest)
        .ThenBy(f => f.Key, StringComparer.Ordinal)];

    private static float Closest(SweepFinding f) =>
        f.Outlier is { } o ? o.DistanceToOtherSku : f.Pairs.Count == 0 ? 0f : f.Pairs.Min(p => p.Evidence.Distance);
}

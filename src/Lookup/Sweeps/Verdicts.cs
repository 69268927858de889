using System.Globalization;

namespace Lookup.Sweeps;

/// <summary>The plain-English verdicts of findings: what it means and what to do.</summary>
public static class Verdicts
{
    /// <summary>Printed with every report, and repeated where a finding invites treating one part as another.</summary>
    public const string SafetyNotice =
        "Visual similarity is not verification: confirm part numbers, dimensions and ratings before merging SKUs or " +
        "substituting one part for another, and follow local codes and licensed practice.";

    /// <summary>The verdict of a group finding.</summary>
    public static string ForGroup(FindingKind kind, IReadOnlyList<FindingMember> members, IReadOnlyList<FindingPair> pairs)
    {
        ArgumentNullException.ThrowIfNull(members);
        ArgumentNullException.ThrowIfNull(pairs);
        var skus = members.Select(m => m.Sku).Distinct(StringComparer.Ordinal).ToList();
        var what = Describe(pairs);
        return kind switch
        {
            FindingKind.SamePhotoSeveralSkus =>
                $"The same photo ({what}) is filed under {skus.Count} SKUs: {Quote(skus)}. A photo shows one part: keep " +
                "it under the SKU it shows and replace it under the others.",
            FindingKind.CopiesInOneSku =>
                $"{members.Count} copies of one photo ({what}) under SKU \"{skus[0]}\". Keep the best one and remove the rest.",
            FindingKind.LookAlikesAcrossSkus =>
                $"Different photos under SKUs {Quote(skus)} look alike: the same part filed twice, or similar parts. " +
                SafetyNotice,
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Not a group finding."),
        };
    }

    /// <summary>The verdict of an outlier finding.</summary>
    public static string ForOutlier(FindingMember flagged, OutlierEvidence evidence)
    {
        ArgumentNullException.ThrowIfNull(flagged);
        ArgumentNullException.ThrowIfNull(evidence);
        if (evidence.FinishDifference is { } finish)
        {
            return string.Create(
                CultureInfo.InvariantCulture,
                $"The part in this photo has another finish (colour and brightness) than every other photo of SKU " +
                $"\"{flagged.Sku}\" (finish difference {finish:0.0}; photos of one SKU usually differ by less than 1) and " +
                $"the finish of SKU \"{evidence.NearestOtherSku}\", whose photo is also closer ({evidence.DistanceToOtherSku:0.000} " +
                $"against {evidence.DistanceToOwnSku:0.000} to its own SKU): it may be filed under the wrong SKU. Check the " +
                $"part in the photo against both SKUs before moving it. {SafetyNotice}");
        }

        return string.Create(
            CultureInfo.InvariantCulture,
            $"This photo is far from the rest of SKU \"{flagged.Sku}\" (distance {evidence.DistanceToOwnSku:0.000}) and " +
            $"closer to SKU \"{evidence.NearestOtherSku}\" ({evidence.DistanceToOtherSku:0.000}): it may be filed under " +
            $"the wrong SKU. Check the part in the photo against both SKUs before moving it. {SafetyNotice}");
    }

    private static string Quote(IEnumerable<string> skus) => string.Join(", ", skus.Select(s => $"\"{s}\""));

    /// <summary>"identical files", "same pixels", or the edits seen, e.g. "copies: cropped, resized".</summary>
    private static string Describe(IReadOnlyList<FindingPair> pairs)
    {
        if (pairs.Count > 0 && pairs.All(p => p.Relation == PairRelation.IdenticalBytes))
        {
            return "identical files";
        }

        if (pairs.Count > 0 && pairs.All(p => p.Relation is PairRelation.IdenticalBytes or PairRelation.SamePixels))
        {
            return "same pixels";
        }

        var edits = pairs.Where(p => p.Relation == PairRelation.Copy).Aggregate(CopyEdits.None, (e, p) => e | p.Evidence.Edits);
        return edits == CopyEdits.None ? "copies: re-saved or tone changed" : $"copies: {EditWords(edits)}";
    }

    /// <summary>The edits as lower-case words, e.g. "cropped, resized".</summary>
    public static string EditWords(CopyEdits edits) => edits == CopyEdits.None
        ? "re-saved or tone changed"
        : string.Join(", ", Enum.GetValues<CopyEdits>().Where(e => e != CopyEdits.None && edits.HasFlag(e))
            .Select(e => e.ToString().ToLowerInvariant()));
}

namespace Lookup.Sweeps;

/// <summary>
/// Turns connected photos into findings: kind from the members' SKUs, key from kind and members, verdict from both.
/// Also used to rebuild a finding after a reviewer's decisions removed some of its pairs.
/// </summary>
internal static class FindingBuilder
{
    /// <summary>A finding of the same-photo family (identical, same pixels, copies), or look-alikes.</summary>
    public static SweepFinding Group(bool samePhoto, IEnumerable<FindingMember> members, IEnumerable<FindingPair> pairs)
    {
        var sortedMembers = members
            .OrderBy(m => m.Sku, StringComparer.Ordinal)
            .ThenBy(m => m.Path, StringComparer.Ordinal)
            .ToList();
        var sortedPairs = pairs.OrderBy(p => p.Evidence.Distance).ThenBy(p => p.Key, StringComparer.Ordinal).ToList();
        var severalSkus = sortedMembers.Select(m => m.Sku).Distinct(StringComparer.Ordinal).Skip(1).Any();
        var kind = !samePhoto ? FindingKind.LookAlikesAcrossSkus
            : severalSkus ? FindingKind.SamePhotoSeveralSkus
            : FindingKind.CopiesInOneSku;
        var key = FindingKeys.Group(kind, sortedMembers.Select(m => m.Sha256));
        return new SweepFinding(kind, key, sortedMembers, sortedPairs, Verdicts.ForGroup(kind, sortedMembers, sortedPairs));
    }

    /// <summary>
    /// Splits pairs into findings of two or more photos: same-photo pairs by connectivity (union-find), look-alike
    /// pairs first by their two SKUs and then by connectivity. Look-alikes are not joined across SKU pairs because
    /// "looks like" does not carry over: in a catalogue of similar parts it would chain hundreds of SKUs into one group.
    /// </summary>
    public static List<SweepFinding> Partition(bool samePhoto, IReadOnlyList<FindingMember> members, IReadOnlyList<FindingPair> pairs)
    {
        var byId = new Dictionary<int, FindingMember>(members.Count);
        foreach (var member in members)
        {
            byId[member.PhotoId] = member;
        }

        var findings = new List<SweepFinding>();
        var batches = samePhoto
            ? [pairs]
            : pairs.GroupBy(p => SkuPair(byId[p.FirstPhotoId].Sku, byId[p.SecondPhotoId].Sku)).Select(g => (IReadOnlyList<FindingPair>)[.. g]);
        foreach (var batch in batches)
        {
            findings.AddRange(Components(samePhoto, byId, batch));
        }

        return findings;
    }

    private static (string, string) SkuPair(string a, string b) => string.CompareOrdinal(a, b) <= 0 ? (a, b) : (b, a);

    private static IEnumerable<SweepFinding> Components(
        bool samePhoto, Dictionary<int, FindingMember> byId, IReadOnlyList<FindingPair> pairs)
    {
        var ids = pairs.SelectMany(p => new[] { p.FirstPhotoId, p.SecondPhotoId }).Distinct().ToList();
        var indexOf = new Dictionary<int, int>(ids.Count);
        for (var i = 0; i < ids.Count; i++)
        {
            indexOf[ids[i]] = i;
        }

        var sets = new UnionFind(ids.Count);
        foreach (var pair in pairs)
        {
            sets.Union(indexOf[pair.FirstPhotoId], indexOf[pair.SecondPhotoId]);
        }

        foreach (var group in pairs.GroupBy(p => sets.Find(indexOf[p.FirstPhotoId])))
        {
            var memberIds = group.SelectMany(p => new[] { p.FirstPhotoId, p.SecondPhotoId }).Distinct();
            yield return Group(samePhoto, memberIds.Select(id => byId[id]), group);
        }
    }
}

namespace Lookup.Sweeps;

/// <summary>One thing for the catalogue owner to look at.</summary>
/// <param name="Kind">What it is; the order of <see cref="FindingKind"/> is the order of severity.</param>
/// <param name="Key">Stable across sweeps (kind plus the members' SHA-256, see <see cref="FindingKeys"/>): used by
/// "new only" and by reviewers' decisions.</param>
/// <param name="Members">The photos, with their SKUs and paths.</param>
/// <param name="Pairs">The pairs that tie the members together, with their evidence (empty for an outlier).</param>
/// <param name="Verdict">What it means and what to do, in plain English.</param>
/// <param name="Outlier">For <see cref="FindingKind.FarFromItsSku"/>: the distances behind it.</param>
public sealed record SweepFinding(
    FindingKind Kind,
    string Key,
    IReadOnlyList<FindingMember> Members,
    IReadOnlyList<FindingPair> Pairs,
    string Verdict,
    OutlierEvidence? Outlier = null)
{
    /// <summary>The distinct SKUs of the members, in order of first appearance.</summary>
    public IReadOnlyList<string> Skus => [.. Members.Select(m => m.Sku).Distinct(StringComparer.Ordinal)];
}

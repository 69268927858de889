namespace Lookup.Sweeps;

/// <summary>
/// Reviewers' "not a duplicate" decisions, by key: dismissed pairs (<see cref="FindingKeys.Pair"/>) and dismissed
/// findings (<see cref="SweepFinding.Key"/>). Immutable: the Dismiss methods return a new set.
/// </summary>
public sealed class ReviewDecisions
{
    private readonly HashSet<string> _pairs;
    private readonly HashSet<string> _findings;

    /// <summary>Decisions as stored.</summary>
    public ReviewDecisions(IEnumerable<string> dismissedPairKeys, IEnumerable<string> dismissedFindingKeys)
    {
        ArgumentNullException.ThrowIfNull(dismissedPairKeys);
        ArgumentNullException.ThrowIfNull(dismissedFindingKeys);
        _pairs = new HashSet<string>(dismissedPairKeys, StringComparer.Ordinal);
        _findings = new HashSet<string>(dismissedFindingKeys, StringComparer.Ordinal);
    }

    /// <summary>No decisions.</summary>
    public static ReviewDecisions None { get; } = new([], []);

    /// <summary>Keys of dismissed pairs.</summary>
    public IReadOnlySet<string> DismissedPairs => _pairs;

    /// <summary>Keys of dismissed findings.</summary>
    public IReadOnlySet<string> DismissedFindings => _findings;

    /// <summary>
    /// Dismisses a whole finding: its key, and every pair in it, so the same photos stay apart even when a new photo
    /// later joins the group (the group then comes back with the new photo's pairs only).
    /// </summary>
    public ReviewDecisions DismissFinding(SweepFinding finding)
    {
        ArgumentNullException.ThrowIfNull(finding);
        return new ReviewDecisions(_pairs.Concat(finding.Pairs.Select(p => p.Key)), _findings.Append(finding.Key));
    }

    /// <summary>Dismisses one pair of photos, given by their SHA-256.</summary>
    public ReviewDecisions DismissPair(string sha256A, string sha256B) =>
        new(_pairs.Append(FindingKeys.Pair(sha256A, sha256B)), _findings);
}

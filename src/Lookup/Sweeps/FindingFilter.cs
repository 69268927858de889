namespace Lookup.Sweeps;

/// <summary>
/// Applies what earlier sweeps and reviewers said to a new sweep's findings. Pure: the caller loads and stores keys.
/// </summary>
public static class FindingFilter
{
    /// <summary>
    /// Drops dismissed findings; removes dismissed pairs from groups and splits what remains into connected groups (a
    /// group all of whose pairs are dismissed disappears, a member tied only by dismissed pairs leaves its group);
    /// with <paramref name="previousKeys"/> (new-only), drops findings an earlier sweep already reported.
    /// </summary>
    /// <returns>The findings left, most severe first, and how many were suppressed by decisions and by new-only.</returns>
    public static (IReadOnlyList<SweepFinding> Findings, int Suppressed, int AlreadyReported) Apply(
        IReadOnlyList<SweepFinding> findings, ReviewDecisions decisions, IReadOnlySet<string>? previousKeys)
    {
        ArgumentNullException.ThrowIfNull(findings);
        ArgumentNullException.ThrowIfNull(decisions);
        var kept = new List<SweepFinding>();
        var (suppressed, alreadyReported) = (0, 0);
        foreach (var finding in findings)
        {
            var survivors = Reviewed(finding, decisions);
            if (survivors.Count == 0)
            {
                suppressed++;
                continue;
            }

            foreach (var survivor in survivors)
            {
                if (previousKeys is not null && previousKeys.Contains(survivor.Key))
                {
                    alreadyReported++;
                }
                else
                {
                    kept.Add(survivor);
                }
            }
        }

        return (FindingOrder.Sort(kept), suppressed, alreadyReported);
    }

    private static List<SweepFinding> Reviewed(SweepFinding finding, ReviewDecisions decisions)
    {
        if (decisions.DismissedFindings.Contains(finding.Key))
        {
            return [];
        }

        if (finding.Kind == FindingKind.FarFromItsSku || !finding.Pairs.Any(p => decisions.DismissedPairs.Contains(p.Key)))
        {
            return [finding];
        }

        var remaining = finding.Pairs.Where(p => !decisions.DismissedPairs.Contains(p.Key)).ToList();
        var samePhoto = finding.Kind != FindingKind.LookAlikesAcrossSkus;
        return [.. FindingBuilder.Partition(samePhoto, finding.Members, remaining)
            .Where(f => !decisions.DismissedFindings.Contains(f.Key))];
    }
}

namespace Lookup.Sweeps;

/// <summary>The result of one sweep: settings, time, counts and findings (most severe first).</summary>
public sealed record SweepReport(
    SweepOptions Settings,
    DateTimeOffset StartedAt,
    DateTimeOffset FinishedAt,
    SweepCounts Counts,
    IReadOnlyList<SweepFinding> Findings)
{
    /// <summary>The safety notice every rendering of the report carries.</summary>
    public string Notice => Verdicts.SafetyNotice;

    /// <summary>Number of findings of each kind, every kind listed.</summary>
    public IReadOnlyDictionary<FindingKind, int> FindingsByKind =>
        Enum.GetValues<FindingKind>().ToDictionary(k => k, k => Findings.Count(f => f.Kind == k));

    /// <summary>The report with reviewers' decisions and (for new-only) the previous sweep's keys applied.</summary>
    public SweepReport Filtered(ReviewDecisions decisions, IReadOnlySet<string>? previousKeys)
    {
        var (findings, suppressed, already) = FindingFilter.Apply(Findings, decisions, previousKeys);
        return this with
        {
            Findings = findings,
            Counts = Counts with { SuppressedByDecisions = suppressed, AlreadyReported = already },
        };
    }
}

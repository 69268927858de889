namespace Lookup.Store;

/// <summary>What <see cref="IndexChecker.Check"/> read and found.</summary>
/// <param name="IndexPath">The index file.</param>
/// <param name="PhotoRecords">Photo records read (indexed and failed).</param>
/// <param name="GraphNodes">Graph nodes counted by the graph metadata (live and retired).</param>
/// <param name="LiveNodes">Graph nodes not retired.</param>
/// <param name="Links">Links checked by the graph's integrity check.</param>
/// <param name="Findings">What is wrong, errors first.</param>
public sealed record IndexCheckReport(string IndexPath, int PhotoRecords, int GraphNodes, int LiveNodes, int Links, IReadOnlyList<CheckFinding> Findings)
{
    /// <summary>True when nothing at error level was found.</summary>
    public bool IsHealthy => Findings.All(f => f.Severity != CheckSeverity.Error);

    /// <summary>True when at least one finding can be repaired without embedding.</summary>
    public bool HasRepairable => Findings.Any(f => f.Repairable);
}

using Lookup.Sweeps;

namespace Lookup.Demo;

/// <summary>Whether the sweep found one planted mistake, and the finding that shows it.</summary>
/// <param name="Defect">The planted mistake.</param>
/// <param name="Finding">The finding that reports it, or null when the sweep missed it.</param>
/// <param name="FindingNumber">The finding's 1-based place in the sweep report, or null.</param>
internal sealed record DefectOutcome(DemoDefect Defect, SweepFinding? Finding, int? FindingNumber)
{
    /// <summary>True when a finding reports the mistake.</summary>
    public bool Found => Finding is not null;
}

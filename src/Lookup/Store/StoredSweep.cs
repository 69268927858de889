namespace Lookup.Store;

/// <summary>One sweep as the index remembers it: when, with what settings, what it saw and found.</summary>
/// <param name="Number">1 for the first sweep of an index, then counting up.</param>
/// <param name="StartedUtc">When the sweep started.</param>
/// <param name="FinishedUtc">When its findings were ready (before storing).</param>
/// <param name="Photos">Photos swept.</param>
/// <param name="Skus">Distinct SKUs among them.</param>
/// <param name="PairsExamined">Pairs within the search radius.</param>
/// <param name="Findings">Findings stored (reviewers' decisions applied, all of them whatever --new-only showed).</param>
/// <param name="NewFindings">Of those, findings the previous stored sweep did not have.</param>
/// <param name="FindingsByKind">Findings per kind code (same-photo, copies, look-alikes, far-from-sku).</param>
/// <param name="SettingsJson">The sweep's thresholds as JSON.</param>
/// <param name="RunBy">user@host that ran it.</param>
public sealed record StoredSweep(
    int Number,
    DateTime StartedUtc,
    DateTime FinishedUtc,
    int Photos,
    int Skus,
    long PairsExamined,
    int Findings,
    int NewFindings,
    IReadOnlyDictionary<string, int> FindingsByKind,
    string SettingsJson,
    string RunBy);

using Lookup.Sweeps;

namespace Lookup.Store;

/// <summary>A finding of a stored sweep: enough to compare sweeps, to dismiss it by key and to say what it was.</summary>
/// <param name="Sweep">The sweep's number.</param>
/// <param name="Order">Its place in that sweep's report, from 1.</param>
/// <param name="Kind">What it is.</param>
/// <param name="Key">Its key (<see cref="FindingKeys"/>).</param>
/// <param name="Members">Its photos, as they were then.</param>
/// <param name="Pairs">The pairs that tie them (empty for a photo far from its SKU).</param>
public sealed record StoredFinding(
    int Sweep,
    int Order,
    FindingKind Kind,
    string Key,
    IReadOnlyList<StoredMember> Members,
    IReadOnlyList<StoredPair> Pairs);

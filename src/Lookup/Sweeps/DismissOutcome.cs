using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>The result of one <see cref="DismissRequest"/>.</summary>
/// <param name="Request">What was asked.</param>
/// <param name="Status">What happened.</param>
/// <param name="Target">Pair or finding, when the request was resolved.</param>
/// <param name="Key">The full key decided on, when resolved.</param>
/// <param name="Paths">The photos concerned.</param>
/// <param name="PairsDismissed">Pair decisions recorded with it (a finding's pairs; 1 for a pair).</param>
/// <param name="Message">A sentence for people: what was recorded, or what is wrong and how to fix it.</param>
public sealed record DismissOutcome(
    DismissRequest Request,
    DismissStatus Status,
    DecisionTarget? Target,
    string? Key,
    IReadOnlyList<string> Paths,
    int PairsDismissed,
    string Message)
{
    /// <summary>True for <see cref="DismissStatus.NotFound"/> and <see cref="DismissStatus.Ambiguous"/>.</summary>
    public bool Failed => Status is DismissStatus.NotFound or DismissStatus.Ambiguous;
}

using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>The result of <see cref="DecisionUndo.Undo"/>.</summary>
/// <param name="Status">What happened.</param>
/// <param name="Decision">The decision taken back (or the one in the way), when one was found.</param>
/// <param name="PairsRestored">Pair decisions removed with a finding's decision.</param>
/// <param name="Message">A sentence for people: what was taken back, or what is wrong and how to fix it.</param>
public sealed record UndoOutcome(UndoStatus Status, ReviewerDecision? Decision, int PairsRestored, string Message);

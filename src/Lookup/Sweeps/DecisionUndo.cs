using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>
/// Takes back a reviewer's "not a duplicate" decision by its key (a unique prefix of at least
/// <see cref="Dismissals.MinKeyPrefix"/> hex digits is enough). A finding's decision goes with the pair decisions
/// recorded with it, so the next sweep reports the finding again (as new when new-only compares with a sweep that did
/// not have it).
/// </summary>
public static class DecisionUndo
{
    /// <summary>Removes the decision whose key is or starts with <paramref name="key"/> from <paramref name="index"/>
    /// (open for writing), in one transaction.</summary>
    public static UndoOutcome Undo(IndexFile index, string key)
    {
        ArgumentNullException.ThrowIfNull(index);
        ArgumentNullException.ThrowIfNull(key);
        index.RequireWritable();
        var prefix = key.Trim().ToLowerInvariant();
        if (prefix.Length < Dismissals.MinKeyPrefix || prefix.Length > 32 || !prefix.All(char.IsAsciiHexDigit))
        {
            return new UndoOutcome(UndoStatus.NotFound, null, 0,
                $"\"{key}\" is not a decision key: give the {Dismissals.MinKeyPrefix} to 32 hex digits shown by lookup dismiss --list.");
        }

        var store = new DecisionStore(index);
        var matches = store.All().Where(d => d.Key.StartsWith(prefix, StringComparison.Ordinal)).ToList();
        if (matches.Count == 0)
        {
            return new UndoOutcome(UndoStatus.NotFound, null, 0,
                $"No decision has a key starting {prefix}: lookup dismiss --list shows the decisions in this index.");
        }

        if (matches.Count > 1)
        {
            return new UndoOutcome(UndoStatus.Ambiguous, null, 0,
                $"{matches.Count} decisions have keys starting {prefix} ({string.Join(", ", matches.Take(3).Select(d => d.Key))}" +
                $"{(matches.Count > 3 ? ", ..." : "")}): give more digits.");
        }

        var decision = matches[0];
        if (decision.Target == DecisionTarget.Pair && decision.ViaFinding is { } via && store.Find(via) is not null)
        {
            return new UndoOutcome(UndoStatus.PartOfFinding, decision, 0,
                $"Pair {decision.Key} was dismissed with finding {via}: undo {via[..12]} to bring the finding back.");
        }

        var restored = 0;
        index.InTransaction(() =>
        {
            store.Remove(decision.Key);
            restored = decision.Target == DecisionTarget.Finding ? store.RemoveRecordedWith(decision.Key) : 0;
        });
        var what = decision.Target == DecisionTarget.Finding
            ? $"finding {decision.Key} and the {restored} pair decision(s) recorded with it"
            : $"pair {decision.Key} ({string.Join(" / ", decision.Paths)})";
        return new UndoOutcome(UndoStatus.Undone, decision, restored,
            $"Took back {decision.Reviewer}'s decision on {what}; the next sweep reports it again if it still holds.");
    }
}

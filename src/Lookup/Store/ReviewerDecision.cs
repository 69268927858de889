namespace Lookup.Store;

/// <summary>
/// A reviewer's "not a duplicate" about a pair of photos or a whole finding, with who said it, when and why.
/// Keys rest on the files' SHA-256, so a decision survives renames and moves.
/// </summary>
/// <param name="Key">The pair key or finding key.</param>
/// <param name="Target">Pair or finding.</param>
/// <param name="Reviewer">Who decided.</param>
/// <param name="DecidedUtc">When.</param>
/// <param name="Note">Why, in the reviewer's words (may be empty).</param>
/// <param name="Paths">The photos concerned as they were named when deciding (for people reading the record).</param>
/// <param name="ViaFinding">For a pair dismissed with a whole finding: that finding's key.</param>
/// <param name="Source">How it was recorded: "command" or "csv:FILE line N".</param>
public sealed record ReviewerDecision(
    string Key,
    DecisionTarget Target,
    string Reviewer,
    DateTime DecidedUtc,
    string Note,
    IReadOnlyList<string> Paths,
    string? ViaFinding,
    string Source);

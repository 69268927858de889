namespace Lookup.Sweeps;

/// <summary>What became of a request to take back a decision.</summary>
public enum UndoStatus
{
    /// <summary>The decision (and, for a finding, the pair decisions recorded with it) is gone.</summary>
    Undone,

    /// <summary>No decision has that key.</summary>
    NotFound,

    /// <summary>The prefix matches more than one decision.</summary>
    Ambiguous,

    /// <summary>A pair dismissed as part of a finding: the finding's decision must be taken back instead.</summary>
    PartOfFinding,
}

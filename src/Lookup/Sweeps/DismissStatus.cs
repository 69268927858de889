namespace Lookup.Sweeps;

/// <summary>What became of a <see cref="DismissRequest"/>.</summary>
public enum DismissStatus
{
    /// <summary>Recorded.</summary>
    Dismissed,

    /// <summary>A reviewer had already dismissed it; the first decision stands.</summary>
    AlreadyDismissed,

    /// <summary>Not recorded: the key or a path names nothing in the index (the message says what and why).</summary>
    NotFound,

    /// <summary>Not recorded: the key prefix fits several findings or pairs.</summary>
    Ambiguous,
}

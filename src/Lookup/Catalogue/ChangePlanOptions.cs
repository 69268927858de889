namespace Lookup.Catalogue;

/// <summary>Choices for <see cref="ChangePlanner"/>.</summary>
internal sealed record ChangePlanOptions
{
    /// <summary>The defaults: missing photos are retired; new files are hashed only when they could be a move.</summary>
    public static ChangePlanOptions Default { get; } = new();

    /// <summary>Keep photos whose files are gone (plan them as <see cref="ChangeKind.Missing"/>, not retired).</summary>
    public bool KeepMissing { get; init; }

    /// <summary>
    /// Hash every new file while planning. Off by default: a new file is hashed only when its length equals a
    /// departed photo's (only then can it be a move), and the others are left for the ingest worker to hash while
    /// it reads the file to decode it, so a first ingest reads each photo once.
    /// </summary>
    public bool HashEveryNewFile { get; init; }
}

namespace Lookup.Catalogue;

/// <summary>Choices for <see cref="ChangePlanner"/>.</summary>
internal sealed record ChangePlanOptions
{
    /// <summary>The defaults: missing photos are retired.</summary>
    public static ChangePlanOptions Default { get; } = new();

    /// <summary>Keep photos whose files are gone (plan them as <see cref="ChangeKind.Missing"/>, not retired).</summary>
    public bool KeepMissing { get; init; }
}

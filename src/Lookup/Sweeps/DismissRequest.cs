namespace Lookup.Sweeps;

/// <summary>
/// One "not a duplicate" to record: a finding or pair key (or a unique prefix of one, at least
/// <see cref="Dismissals.MinKeyPrefix"/> hex digits), or two photos by path.
/// </summary>
/// <param name="Key">A finding or pair key or prefix; null when <paramref name="FirstPath"/> and <paramref name="SecondPath"/> are given.</param>
/// <param name="FirstPath">One photo: relative to the catalogue root, or a file path under it.</param>
/// <param name="SecondPath">The other photo.</param>
/// <param name="Note">Why, in the reviewer's words.</param>
/// <param name="Reviewer">Who decided; null for the caller's default.</param>
/// <param name="Source">Where the request came from ("command", "decisions.csv line 4").</param>
public sealed record DismissRequest(string? Key, string? FirstPath, string? SecondPath, string Note, string? Reviewer, string Source)
{
    /// <summary>A request by key.</summary>
    public static DismissRequest ForKey(string key, string note = "", string? reviewer = null, string source = "command") =>
        new(key, null, null, note, reviewer, source);

    /// <summary>A request for two photos.</summary>
    public static DismissRequest ForPair(string first, string second, string note = "", string? reviewer = null, string source = "command") =>
        new(null, first, second, note, reviewer, source);

    /// <summary>The request in words, for messages.</summary>
    public override string ToString() => Key ?? $"{FirstPath} + {SecondPath}";
}

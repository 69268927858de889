namespace Lookup.Catalogue;

/// <summary>What an ingest must do to bring the index in line with the scanned tree.</summary>
/// <param name="Items">One item per current path and per known path no longer present, ordered by path (ordinal).</param>
/// <param name="FilesHashed">How many files were read to compute a SHA-256.</param>
internal sealed record ChangePlan(IReadOnlyList<PlannedChange> Items, int FilesHashed)
{
    private static readonly ChangeKind[] PresentKinds =
        [ChangeKind.Unchanged, ChangeKind.Touched, ChangeKind.SkuChanged, ChangeKind.Changed, ChangeKind.New, ChangeKind.Moved];

    /// <summary>The items of one kind, in path order.</summary>
    public IEnumerable<PlannedChange> Of(ChangeKind kind) => Items.Where(i => i.Kind == kind);

    /// <summary>How many items are of one kind.</summary>
    public int Count(ChangeKind kind) => Items.Count(i => i.Kind == kind);

    /// <summary>
    /// Present paths that hold byte-identical content, grouped by SHA-256 (groups and paths in ordinal order).
    /// These stay separate photos; they are catalogue defects to report. Only content whose hash is known is
    /// grouped: unchanged files carry their recorded hash, and files never hashed are left out.
    /// </summary>
    public IReadOnlyList<IReadOnlyList<string>> DuplicateContent =>
    [
        .. Items
            .Where(i => i.Sha256 is not null && PresentKinds.Contains(i.Kind))
            .GroupBy(i => i.Sha256!, StringComparer.OrdinalIgnoreCase)
            .Where(g => g.Count() > 1)
            .Select(g => (IReadOnlyList<string>)[.. g.Select(i => i.RelativePath).Order(StringComparer.Ordinal)])
            .OrderBy(g => g[0], StringComparer.Ordinal),
    ];
}

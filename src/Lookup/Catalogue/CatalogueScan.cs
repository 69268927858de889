namespace Lookup.Catalogue;

/// <summary>The result of scanning one folder tree.</summary>
/// <param name="Root">Absolute path of the scanned folder, without a trailing separator.</param>
/// <param name="Entries">Images and flagged files, ordered by <see cref="CatalogueEntry.RelativePath"/> (ordinal).</param>
/// <param name="Problems">Paths that could not be taken in, in the order they were met.</param>
/// <param name="SkippedNonImages">Files skipped silently: no image signature and no image extension.</param>
/// <param name="SkippedHidden">Hidden files and folders skipped (dot-prefixed names or the Hidden attribute).</param>
/// <param name="SkippedLinks">Symbolic links skipped because <see cref="ScanOptions.FollowLinks"/> was off.</param>
internal sealed record CatalogueScan(
    string Root,
    IReadOnlyList<CatalogueEntry> Entries,
    IReadOnlyList<ScanProblem> Problems,
    int SkippedNonImages,
    int SkippedHidden,
    int SkippedLinks)
{
    /// <summary>
    /// Relative paths that exist but could not be read; known photos at or below them are not gone
    /// (pass these to <see cref="ChangePlanner.Plan"/>).
    /// </summary>
    public IReadOnlyList<string> Unreadable =>
        [.. Problems.Where(p => p.HidesContent).Select(p => p.RelativePath)];
}

namespace Lookup.Catalogue;

/// <summary>How <see cref="CatalogueScanner"/> walks a tree.</summary>
internal sealed record ScanOptions
{
    /// <summary>The defaults: follow links, at most 64 folder levels.</summary>
    public static ScanOptions Default { get; } = new();

    /// <summary>
    /// Follow symbolic links (and Windows junctions) to files and folders. Each real folder is scanned once;
    /// when false, links are skipped and counted in <see cref="CatalogueScan.SkippedLinks"/>.
    /// </summary>
    public bool FollowLinks { get; init; } = true;

    /// <summary>Folder levels below the root that are entered; deeper folders are reported, not scanned.</summary>
    public int MaxDepth { get; init; } = 64;
}

namespace Lookup.Catalogue;

/// <summary>
/// Walks a folder tree and lists the photos in it, recognised by content. The walk is deterministic: names are
/// visited in ordinal order and the result is sorted by relative path. Nothing met inside the tree throws:
/// unreadable, vanished, looping or oddly named paths become <see cref="ScanProblem"/>s.
/// </summary>
/// <remarks>
/// Links: with <see cref="ScanOptions.FollowLinks"/> (the default) links to files and folders are followed.
/// Every real folder is scanned once, identified by its fully resolved path. Linked folders are entered only after
/// every real folder under the root has been scanned, so a folder reached both directly and through a link is
/// always listed under its own path, and a link back to an ancestor is reported, not walked.
/// Hidden names (dot-prefixed, or carrying the Hidden attribute) are skipped below the root; the root itself is
/// scanned even if hidden, because the caller named it. Zero-length files are never opened, which also keeps the
/// scan away from pipes and device nodes (they report a length of zero). An instance holds only its options, so
/// concurrent scans are safe.
/// </remarks>
internal sealed partial class CatalogueScanner
{
    private readonly ScanOptions _options;
    private readonly ScanIo _io;

    /// <summary>A scanner with the given options (defaults when null).</summary>
    public CatalogueScanner(ScanOptions? options = null)
        : this(options ?? ScanOptions.Default, ScanIo.Default)
    {
    }

    internal CatalogueScanner(ScanOptions options, ScanIo io)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(options.MaxDepth);
        _options = options;
        _io = io;
    }

    /// <summary>Scans the tree under <paramref name="root"/>.</summary>
    /// <exception cref="DirectoryNotFoundException">The root does not exist or is a file.</exception>
    public CatalogueScan Scan(string root, CancellationToken cancellationToken = default)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(root);
        var fullRoot = Path.TrimEndingDirectorySeparator(Path.GetFullPath(root));
        if (!Directory.Exists(fullRoot))
        {
            throw new DirectoryNotFoundException(File.Exists(fullRoot)
                ? $"{fullRoot} is a file; give the folder that holds the catalogue photos."
                : $"{fullRoot} does not exist; check the path of the catalogue folder.");
        }

        var realRoot = RealPath.Resolve(fullRoot) ?? throw new DirectoryNotFoundException(
            $"{fullRoot} cannot be resolved (its links loop or point nowhere); give the folder's real path.");
        var walk = new Walk(this, fullRoot, cancellationToken);
        walk.Run(realRoot);
        return walk.ToResult();
    }
}

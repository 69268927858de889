namespace Lookup.Catalogue;

/// <summary>
/// Compares what the index knows with what the scan found and says what to do with each path, reading as few
/// files as possible.
/// </summary>
/// <remarks>
/// Rules, in order:
/// 1. A current path that is known with the same size and modification time is unchanged; it is not hashed.
/// 2. A known path whose size or time differ is hashed once: an equal hash makes it touched, a different one
///    changed. A new path is hashed only when it could be a move (its length equals a departed photo's) or when
///    <see cref="ChangePlanOptions.HashEveryNewFile"/> is set; otherwise its item carries no hash and the ingest
///    computes it while reading the file.
/// 3. Same content with a different SKU from the mapping is SKU-changed. An unmapped photo (null SKU) never
///    overwrites a known SKU.
/// 4. A known path not present now is gone, unless it lies at or under a path the scan could not read
///    (unverified: kept as is).
/// 5. A new path whose SHA-256 equals a departed path's is that photo moved: the record and its node travel, nothing is
///    embedded again. Only paths that are gone can be the source of a move, so a copy of a file that is still in
///    place is new (two photos, a duplicate to report), never a move. When several gone and new paths share one
///    hash they are paired in path order; extra new paths are new, extra gone paths are gone.
/// Every item is ordered by path, so the same inputs always give the same plan.
/// </remarks>
/// <param name="hashFile">Computes the lower-case hex SHA-256 of a file from its absolute path; injectable so
/// tests can count calls. Its I/O exceptions become <see cref="ChangeKind.HashFailed"/> items.</param>
internal sealed partial class ChangePlanner(Func<string, string> hashFile)
{
    private readonly Func<string, string> _hashFile = hashFile ?? throw new ArgumentNullException(nameof(hashFile));

    /// <summary>A planner that hashes with <see cref="ContentHash.Sha256Hex(string)"/>.</summary>
    public ChangePlanner()
        : this(ContentHash.Sha256Hex)
    {
    }

    /// <summary>Plans the changes from <paramref name="known"/> to <paramref name="current"/>.</summary>
    /// <param name="known">The index's photos; relative paths must be unique.</param>
    /// <param name="current">The scanned entries with their SKUs; relative paths must be unique.</param>
    /// <param name="unreadable">Relative paths the scan could not read (<see cref="CatalogueScan.Unreadable"/>); "" is the root.</param>
    /// <param name="options">Choices; defaults when null.</param>
    /// <param name="cancellationToken">Stops between files.</param>
    public ChangePlan Plan(
        IReadOnlyList<KnownPhoto> known,
        IReadOnlyList<MappedEntry> current,
        IReadOnlyCollection<string>? unreadable = null,
        ChangePlanOptions? options = null,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(known);
        ArgumentNullException.ThrowIfNull(current);
        var run = new Run(this, IndexKnown(known), unreadable ?? [], options ?? ChangePlanOptions.Default, cancellationToken);
        return run.Plan(current);
    }

    private static Dictionary<string, KnownPhoto> IndexKnown(IReadOnlyList<KnownPhoto> known)
    {
        var byPath = new Dictionary<string, KnownPhoto>(known.Count, StringComparer.Ordinal);
        foreach (var photo in known)
        {
            if (!byPath.TryAdd(photo.RelativePath, photo))
            {
                throw new ArgumentException(
                    $"the index lists {photo.RelativePath} twice; each known photo needs a unique relative path.", nameof(known));
            }
        }

        return byPath;
    }
}

using Lookup.Store;

namespace Lookup.Matching;

/// <summary>
/// A query made of vectors already in the index: one catalogue photo (by its relative path) or every photo of a SKU,
/// so nothing is decoded or embedded. The query's own photos are excluded from the answer.
/// </summary>
/// <param name="Description">What was asked for, for the answer's heading ("photo X" or "SKU Y (3 photos)").</param>
/// <param name="Photos">One query photo per stored vector.</param>
/// <param name="Exclude">The graph nodes of those photos.</param>
internal sealed record LikeQuery(string Description, IReadOnlyList<QueryPhoto> Photos, IReadOnlySet<int> Exclude)
{
    /// <summary>Resolves <paramref name="target"/>: a catalogue-relative photo path first, then a SKU.</summary>
    /// <exception cref="LikeTargetException">Neither, or a photo that failed to index.</exception>
    public static LikeQuery Resolve(MatchIndex index, string target)
    {
        ArgumentNullException.ThrowIfNull(index);
        ArgumentException.ThrowIfNullOrWhiteSpace(target);
        string path = target.Replace('\\', '/');
        while (path.StartsWith("./", StringComparison.Ordinal))
        {
            path = path[2..];
        }

        if (index.FindPhoto(path) is { } record)
        {
            if (record.Status != PhotoStatus.Indexed || record.NodeId is not int node)
            {
                throw new LikeTargetException(
                    $"{path} is in {index.Path} but was not indexed ({record.FailureMessage ?? record.FailureReason ?? "failed"}); fix the photo and run ingest again, or give another photo or a SKU.");
            }

            return new LikeQuery($"photo {path}", [Stored(index, record)], new HashSet<int> { node });
        }

        var photos = index.PhotosOf(target);
        if (photos.Count > 0)
        {
            return new LikeQuery(
                $"SKU {target} ({photos.Count} photo{(photos.Count == 1 ? "" : "s")})",
                [.. photos.Select(r => Stored(index, r))],
                photos.Select(r => r.NodeId!.Value).ToHashSet());
        }

        string root = index.Settings?.CatalogueRoot is { } r ? $" (catalogue root {r})" : "";
        throw new LikeTargetException(
            $"'{target}' is neither a photo nor a SKU in {index.Path}. Give a photo path relative to the catalogue root{root} as ingest recorded it, e.g. 'SKU-FOLDER/photo.jpg', or a SKU exactly as filed.");
    }

    private static QueryPhoto Stored(MatchIndex index, PhotoRecord record) =>
        new(record.Path, [index.Vector(record.NodeId!.Value).ToArray()], record.Sha256, record.DHash);
}

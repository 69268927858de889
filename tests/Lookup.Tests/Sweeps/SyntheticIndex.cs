using Lookup.Graph;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

/// <summary>Writes sweep photos into a real index file as ingest would: photo records plus graph nodes (test data only).</summary>
internal static class SyntheticIndex
{
    /// <summary>Graph settings that always walk the graph (no exact scan), so the HNSW path is what gets tested.</summary>
    public static readonly HnswParameters WalkAlways = new(ExactBelow: 0);

    /// <summary>Adds <paramref name="photos"/> (creating index and graph when missing); returns each photo's node id.</summary>
    public static Dictionary<int, int> Add(string indexPath, IEnumerable<SweepPhoto> photos)
    {
        using var file = IndexFile.Open(indexPath, IndexAccess.Write);
        var store = new GraphStore(file);
        var list = photos.ToList();
        var graph = store.HasGraph ? store.Load() : store.Create(list[0].Embedding.Length, WalkAlways, "synthetic");
        var table = new PhotoTable(file);
        var nodeOf = new Dictionary<int, int>();
        file.InTransaction(() =>
        {
            new CatalogueSettings("/catalogue", "folder", "{}", "synthetic", DateTime.UnixEpoch).Write(file);
            foreach (var photo in list)
            {
                var node = graph.Add(photo.Embedding.Span);
                nodeOf[photo.Id] = node;
                table.Upsert(Record(photo, node));
            }

            store.Commit(graph);
        });
        return nodeOf;
    }

    public static PhotoRecord Record(SweepPhoto photo, int? node) => new()
    {
        Path = photo.Path,
        Sku = photo.Sku,
        Size = photo.FileSize,
        Sha256 = photo.Sha256,
        Status = PhotoStatus.Indexed,
        NodeId = node,
        Width = photo.Width,
        Height = photo.Height,
        Format = "PNG",
        DHash = photo.DHash,
        Thumbnail = photo.Thumbnail?.Pixels.ToArray(),
        Detail = photo.Detail?.Pixels.ToArray(),
        Chroma = photo.Chroma?.Planes.ToArray(),
        UpdatedUtc = DateTime.UnixEpoch,
    };
}

using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>
/// The sweep's photos from an index: every indexed photo record with a SKU and a live graph node, its embedding read
/// in place from the loaded graph (no copy) and its stored thumbnails (32 × 32 grey, 64 × 64 detail, 32 × 32 colour). A photo's sweep id is its node id.
/// </summary>
internal static class IndexPhotos
{
    /// <summary>The photos, and how many indexed records were left out (no SKU; no live node or a node two records share).</summary>
    public static (List<SweepPhoto> Photos, int WithoutSku, int WithoutNode) Read(IEnumerable<PhotoRecord> records, HnswGraph graph)
    {
        var photos = new List<SweepPhoto>();
        var taken = new HashSet<int>();
        var (withoutSku, withoutNode) = (0, 0);
        var vectors = graph.State.Vectors;
        foreach (var record in records)
        {
            if (record.Status != PhotoStatus.Indexed)
            {
                continue;
            }

            if (record.NodeId is not int node || node < 0 || node >= graph.Count || graph.IsDeleted(node) || !taken.Add(node)
                || string.IsNullOrEmpty(record.Sha256))
            {
                withoutNode++;
                continue;
            }

            if (string.IsNullOrEmpty(record.Sku))
            {
                withoutSku++;
                continue;
            }

            var thumbnail = record.Thumbnail is { Length: GreyThumbnail.Length } bytes ? new GreyThumbnail(bytes) : null;
            var detail = record.Detail is { Length: DetailThumbnail.Length } fine ? new DetailThumbnail(fine) : null;
            var chroma = record.Chroma is { Length: ChromaThumbnail.Length } colour ? new ChromaThumbnail(colour) : null;
            photos.Add(new SweepPhoto(
                node, record.Sku, record.Path, record.Sha256, record.DHash, record.Width, record.Height, record.Size,
                new ReadOnlyMemory<float>(vectors, node * graph.Dimension, graph.Dimension), thumbnail, detail, chroma));
        }

        return (photos, withoutSku, withoutNode);
    }
}

using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// Everything an index file holds about photos, read once through a read-only handle: the photo records and the
/// whole graph. Searches go through the graph and back to records with <see cref="PhotoTable.FindByNode"/>'s rule
/// (the indexed record whose node is the hit), so a test sees what a user's query would see.
/// </summary>
internal sealed class IndexSnapshot
{
    private IndexSnapshot(IReadOnlyDictionary<string, PhotoRecord> records, HnswGraph? graph, Func<int, PhotoRecord?> byNode)
    {
        Records = records;
        Graph = graph;
        ByNode = byNode;
    }

    public IReadOnlyDictionary<string, PhotoRecord> Records { get; }

    /// <summary>The graph, or null when the index holds none yet.</summary>
    public HnswGraph? Graph { get; }

    /// <summary>The record a graph node belongs to, looked up through the index's own node index.</summary>
    public Func<int, PhotoRecord?> ByNode { get; }

    public IEnumerable<PhotoRecord> Indexed => Records.Values.Where(r => r.Status == PhotoStatus.Indexed);

    public IEnumerable<PhotoRecord> Failed => Records.Values.Where(r => r.Status == PhotoStatus.Failed);

    public static IndexSnapshot Read(string indexPath)
    {
        using var file = IndexFile.Open(indexPath, IndexAccess.Read);
        var table = new PhotoTable(file);
        var records = table.All().ToDictionary(r => r.Path, StringComparer.Ordinal);
        var store = new GraphStore(file);
        var graph = store.HasGraph ? store.Load() : null;
        var byNode = records.Values.Where(r => r.NodeId is not null).Select(r => r.NodeId!.Value).Distinct()
            .ToDictionary(n => n, n => table.FindByNode(n));
        return new IndexSnapshot(records, graph, n => byNode.TryGetValue(n, out var r) ? r : null);
    }

    /// <summary>The nearest live node to <paramref name="embedding"/> and the record holding it.</summary>
    public (PhotoRecord? Record, Neighbour Hit) Nearest(float[] embedding)
    {
        var hit = RequireGraph().Search(embedding, 1).Single();
        return (ByNode(hit.Id), hit);
    }

    /// <summary>Every live node, nearest first.</summary>
    public Neighbour[] SearchAll(float[] embedding) => RequireGraph().Search(embedding, Math.Max(1, RequireGraph().LiveCount));

    /// <summary>
    /// A digest of every photo record (all fields, thumbnails included) and every node (vector, deletion), so two
    /// snapshots compare equal only when nothing a search or a sweep reads has changed.
    /// </summary>
    public string Digest()
    {
        var text = new StringBuilder();
        foreach (var r in Records.Values.OrderBy(r => r.Path, StringComparer.Ordinal))
        {
            text.Append(CultureInfo.InvariantCulture,
                $"{r.Path}|{r.Sku}|{r.Size}|{r.MtimeUtcTicks}|{r.Sha256}|{r.Status}|{r.NodeId}|{r.Width}x{r.Height}|{r.Format}|{r.DHash}|{r.UpdatedUtc.Ticks}|{r.FailureReason}|{r.FailureMessage}|")
                .Append(r.Thumbnail is null ? "-" : Convert.ToHexString(SHA256.HashData(r.Thumbnail))).Append('|')
                .Append(r.Detail is null ? "-" : Convert.ToHexString(SHA256.HashData(r.Detail))).Append('|')
                .Append(r.Chroma is null ? "-" : Convert.ToHexString(SHA256.HashData(r.Chroma))).Append('\n');
        }

        if (Graph is not null)
        {
            text.Append(CultureInfo.InvariantCulture, $"graph {Graph.Count} {Graph.LiveCount}\n");
            for (int id = 0; id < Graph.Count; id++)
            {
                var bytes = System.Runtime.InteropServices.MemoryMarshal.AsBytes(Graph.GetVector(id));
                text.Append(CultureInfo.InvariantCulture, $"{id} {Graph.IsDeleted(id)} {Convert.ToHexString(SHA256.HashData(bytes))}\n");
            }
        }

        return text.ToString();
    }

    private HnswGraph RequireGraph() => Graph ?? throw new InvalidOperationException("the index holds no graph");
}

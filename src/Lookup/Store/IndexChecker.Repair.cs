using Lookup.Graph;

namespace Lookup.Store;

/// <summary>Repairing an index without embedding anything.</summary>
public static partial class IndexChecker
{
    /// <summary>
    /// Checks <paramref name="file"/> (the writer) and, when something repairable was found, rebuilds the graph from
    /// the stored vectors of the indexed photo records that own exactly one sound, live node; records that do not
    /// (no node, a retired, shared, missing or damaged one) and records that cannot be read are removed, so the next
    /// ingest embeds those photos again. Retired and orphan nodes are left out; node ids are renumbered in path
    /// order. Everything (records, graph documents, metadata) changes in one transaction: a crash or error leaves the
    /// file exactly as it was.
    /// </summary>
    /// <param name="file">The index, opened for writing.</param>
    /// <param name="verifyModelFiles">Also verify the model fingerprint (as <see cref="Check"/>).</param>
    public static IndexRepairResult Repair(IndexFile file, bool verifyModelFiles = true) => Repair(file, verifyModelFiles, beforeGraphWrite: null);

    /// <param name="file">The index, opened for writing.</param>
    /// <param name="verifyModelFiles">Also verify the model fingerprint.</param>
    /// <param name="beforeGraphWrite">Test hook called inside the transaction once the old graph is deleted; a throw there must roll everything back.</param>
    internal static IndexRepairResult Repair(IndexFile file, bool verifyModelFiles, Action? beforeGraphWrite)
    {
        ArgumentNullException.ThrowIfNull(file);
        file.RequireWritable();
        var stored = ReadAll(file);
        var before = Analyse(file.Path, stored, verifyModelFiles);
        if (!before.Findings.Any(f => f.Repairable) || (!CanRebuild(stored) && stored.DamagedRecords.Count == 0))
        {
            return new IndexRepairResult(before, before, false, 0, 0, 0, []);
        }

        var meta = stored.Meta;
        var indexed = stored.Records.Where(r => r.Status == PhotoStatus.Indexed).ToList();
        var claims = indexed.Where(r => r.NodeId is not null).GroupBy(r => r.NodeId!.Value).ToDictionary(g => g.Key, g => g.Count());
        bool Usable(PhotoRecord r) =>
            r.NodeId is int id
            && claims[id] == 1
            && stored.Vectors.ContainsKey(id)
            && (meta is null || (id < meta.Count && !meta.IsDeleted(id)));
        var kept = indexed.Where(Usable).ToList();
        var dropped = indexed.Where(r => !Usable(r)).Select(r => r.Path).ToList();
        bool rebuild = CanRebuild(stored);
        var graph = rebuild ? new HnswGraph(stored.Dimension, meta?.Parameters ?? new HnswParameters()) : null;
        var renumbered = new List<PhotoRecord>(kept.Count);
        if (graph is not null)
        {
            foreach (var record in kept)
            {
                renumbered.Add(record with { NodeId = graph.Add(stored.Vectors[record.NodeId!.Value]) });
            }
        }

        var photos = new PhotoTable(file);
        var db = file.Database;
        file.InTransaction(() =>
        {
            var collection = db.GetCollection(PhotoTable.CollectionName);
            foreach (var (id, _) in stored.DamagedRecords)
            {
                collection.Delete(id);
            }

            if (graph is null)
            {
                return;
            }

            foreach (string path in dropped)
            {
                photos.Delete(path);
            }

            foreach (var record in renumbered)
            {
                photos.Upsert(record);
            }

            db.GetCollection(NodeCodec.VectorCollection).DeleteAll();
            db.GetCollection(NodeCodec.LinkCollection).DeleteAll();
            db.GetCollection(GraphStore.MetaCollection).DeleteAll();
            beforeGraphWrite?.Invoke();
            new GraphStore(file).Save(graph, (meta?.ModelFingerprint ?? stored.Settings?.ModelFingerprint)!);
        });

        var after = Check(file, verifyModelFiles);
        int oldNodes = meta?.Count ?? stored.Vectors.Count + stored.DamagedVectors.Count;
        return new IndexRepairResult(
            before,
            after,
            graph is not null,
            graph?.Count ?? 0,
            graph is null ? 0 : oldNodes - graph.Count,
            stored.DamagedRecords.Count + (graph is null ? 0 : dropped.Count),
            graph is null ? [] : dropped);
    }
}

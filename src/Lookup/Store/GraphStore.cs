using Lookup.Graph;

namespace Lookup.Store;

/// <summary>
/// Keeps an <see cref="HnswGraph"/> in an <see cref="IndexFile"/>: node documents (vector; level and links) and
/// one metadata document (settings, counts, entry point, model fingerprint, tombstones).
/// <list type="bullet">
/// <item>Writer: <see cref="Create"/> or <see cref="Load"/> gives an in-memory graph that records which nodes
/// change; <see cref="Commit"/> writes exactly those nodes plus the metadata in one transaction, so a crash
/// leaves either the whole batch or none of it, never a link to a node that is not there.</item>
/// <item>Reader: <see cref="OpenLazy"/> reads only the metadata and fetches the nodes a search visits;
/// <see cref="Load"/> on a read-only file loads everything for bulk work such as sweeps.</item>
/// </list>
/// Thread safety: one GraphStore per IndexFile handle; <see cref="Commit"/> on the writer thread only.
/// </summary>
public sealed class GraphStore
{
    internal const string MetaCollection = "graph_meta";

    private readonly IndexFile _file;
    private HnswGraph? _graph;
    private string _fingerprint = "";
    private int _savedCount;

    /// <summary>The graph store inside <paramref name="file"/>.</summary>
    public GraphStore(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        _file = file;
    }

    /// <summary>True when the file already holds a graph.</summary>
    public bool HasGraph => ReadMeta() is not null;

    /// <summary>The model fingerprint the stored graph was built with, or null when there is no graph.</summary>
    public string? ModelFingerprint => ReadMeta()?.ModelFingerprint;

    /// <summary>Starts an empty graph in a writable file that has none.</summary>
    /// <param name="dimension">Embedding length.</param>
    /// <param name="parameters">Graph settings, stored with the graph.</param>
    /// <param name="modelFingerprint">Identifies the embedding model and preprocessing; later opens compare it.</param>
    public HnswGraph Create(int dimension, HnswParameters parameters, string modelFingerprint)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        ArgumentException.ThrowIfNullOrWhiteSpace(modelFingerprint);
        _file.RequireWritable();
        if (HasGraph)
        {
            throw new InvalidOperationException($"{_file.Path} already holds a graph; load it instead of creating another.");
        }

        var graph = new HnswGraph(dimension, parameters);
        graph.TrackChanges();
        _graph = graph;
        _fingerprint = modelFingerprint;
        _savedCount = 0;
        _file.InTransaction(() => WriteMeta(graph));
        return graph;
    }

    /// <summary>
    /// Writes a graph built in memory (a bulk build) into a writable file that has no graph yet, in transactions of
    /// <paramref name="nodesPerTransaction"/> nodes with the metadata last: a crash part-way leaves a file with no
    /// graph, never half of one. Afterwards <see cref="Commit"/> saves further changes to the same graph.
    /// </summary>
    public void Save(HnswGraph graph, string modelFingerprint, int nodesPerTransaction = 10_000)
    {
        ArgumentNullException.ThrowIfNull(graph);
        ArgumentException.ThrowIfNullOrWhiteSpace(modelFingerprint);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(nodesPerTransaction);
        _file.RequireWritable();
        if (HasGraph)
        {
            throw new InvalidOperationException($"{_file.Path} already holds a graph; Save is for a file without one.");
        }

        graph.TrackChanges();
        graph.TakeChanged();
        var state = graph.State;
        var vectors = _file.Database.GetCollection(NodeCodec.VectorCollection);
        var links = _file.Database.GetCollection(NodeCodec.LinkCollection);
        for (int start = 0; start < graph.Count; start += nodesPerTransaction)
        {
            int end = Math.Min(start + nodesPerTransaction, graph.Count);
            _file.InTransaction(() =>
            {
                for (int id = start; id < end; id++)
                {
                    vectors.Upsert(NodeCodec.VectorDocument(id, state.Vectors.AsSpan(id * graph.Dimension, graph.Dimension)));
                    links.Upsert(NodeCodec.LinkDocument(state, id));
                }
            });
        }

        _graph = graph;
        _fingerprint = modelFingerprint;
        _file.InTransaction(() => WriteMeta(graph));
        _savedCount = graph.Count;
    }

    /// <summary>Loads the whole graph into memory (writer: for further inserts; reader: for bulk work).</summary>
    /// <param name="expectedModelFingerprint">When given, a graph built with another model is refused.</param>
    public HnswGraph Load(string? expectedModelFingerprint = null)
    {
        var meta = RequireMeta(expectedModelFingerprint);
        var state = new GraphState(meta.Dimension, meta.Parameters.M, Math.Max(meta.Count, 16));
        var db = _file.Database;
        foreach (var doc in db.GetCollection(NodeCodec.VectorCollection).FindAll())
        {
            int id = doc["_id"].AsInt32;
            if (id < meta.Count)
            {
                NodeCodec.ReadVector(doc, state.Vectors.AsSpan(id * meta.Dimension, meta.Dimension));
            }
        }

        foreach (var doc in db.GetCollection(NodeCodec.LinkCollection).FindAll())
        {
            int id = doc["_id"].AsInt32;
            if (id < meta.Count)
            {
                NodeCodec.ReadLinks(doc, state, id);
            }
        }

        for (int id = 0; id < meta.Count; id++)
        {
            state.Deleted[id] = meta.IsDeleted(id);
        }

        var graph = HnswGraph.Restore(meta.Dimension, meta.Parameters, state, meta.Count, meta.Entry);
        if (_file.IsWritable)
        {
            graph.TrackChanges();
            _graph = graph;
            _fingerprint = meta.ModelFingerprint;
            _savedCount = meta.Count;
        }

        return graph;
    }

    /// <summary>A read view that fetches nodes on demand: opening reads one document, a search reads the nodes it visits.</summary>
    /// <param name="expectedModelFingerprint">When given, a graph built with another model is refused.</param>
    public PersistedGraph OpenLazy(string? expectedModelFingerprint = null) =>
        new(_file.Database, RequireMeta(expectedModelFingerprint));

    /// <summary>
    /// Writes every node changed since the last commit (new nodes' vectors, all changed link lists) and the
    /// metadata, in one transaction (joining the caller's, so photo records can commit with it).
    /// </summary>
    /// <returns>How many link documents were written.</returns>
    public int Commit(HnswGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        _file.RequireWritable();
        if (!ReferenceEquals(graph, _graph))
        {
            throw new InvalidOperationException("Commit takes the graph this store created or loaded.");
        }

        var changed = graph.TakeChanged();
        try
        {
            _file.InTransaction(() =>
            {
                var state = graph.State;
                var vectors = _file.Database.GetCollection(NodeCodec.VectorCollection);
                var links = _file.Database.GetCollection(NodeCodec.LinkCollection);
                foreach (int id in changed)
                {
                    if (id >= _savedCount)
                    {
                        vectors.Upsert(NodeCodec.VectorDocument(id, state.Vectors.AsSpan(id * graph.Dimension, graph.Dimension)));
                    }

                    links.Upsert(NodeCodec.LinkDocument(state, id));
                }

                WriteMeta(graph);
            });
        }
        catch
        {
            graph.Remark(changed);
            throw;
        }

        _savedCount = graph.Count;
        return changed.Length;
    }

    private void WriteMeta(HnswGraph graph)
    {
        var meta = new GraphMeta(
            graph.Dimension,
            graph.Parameters,
            graph.Count,
            graph.LiveCount,
            graph.Entry,
            _fingerprint,
            GraphMeta.Bits(graph.State.Deleted.AsSpan(0, graph.Count)));
        _file.Database.GetCollection(MetaCollection).Upsert(meta.ToBson());
    }

    private GraphMeta? ReadMeta()
    {
        var doc = _file.Database.CollectionExists(MetaCollection)
            ? _file.Database.GetCollection(MetaCollection).FindById(GraphMeta.Id)
            : null;
        return doc is null ? null : GraphMeta.FromBson(doc);
    }

    private GraphMeta RequireMeta(string? expectedModelFingerprint)
    {
        var meta = ReadMeta() ?? throw new IndexFileException(_file.Path, IndexFileProblem.NoGraph, $"{_file.Path} holds no graph yet: run ingest to add photos first.");
        if (expectedModelFingerprint is not null && expectedModelFingerprint != meta.ModelFingerprint)
        {
            throw new IndexFileException(
                _file.Path,
                IndexFileProblem.ModelMismatch,
                $"{_file.Path} was built with model {meta.ModelFingerprint}, this run uses {expectedModelFingerprint}: use the model the index was built with, or build a new index.");
        }

        return meta;
    }
}

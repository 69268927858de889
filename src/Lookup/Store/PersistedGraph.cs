using System.Collections.Concurrent;
using LiteDB;
using Lookup.Graph;

namespace Lookup.Store;

/// <summary>
/// A stored graph searched in place: opening reads the metadata document only; each search fetches the vectors
/// and link lists of the nodes it visits (a few thousand of 100,000 at EfSearch 64) and caches them, running the
/// same algorithm code as the in-memory <see cref="HnswGraph"/>, so answers are identical. Read-only: a snapshot of
/// the file as of its <see cref="IndexFile"/> open.
/// Thread safety: any number of concurrent searches (the caches are concurrent; LiteDB is thread-safe).
/// </summary>
public sealed class PersistedGraph : INearestSearch
{
    private readonly ILiteCollection<BsonDocument> _vectors;
    private readonly ILiteCollection<BsonDocument> _links;
    private readonly GraphMeta _meta;
    private readonly ConcurrentDictionary<int, float[]> _vectorCache = new();
    private readonly ConcurrentDictionary<int, int[][]> _linkCache = new();
    private readonly Lazy<float[]> _all;

    internal PersistedGraph(LiteDatabase database, GraphMeta meta)
    {
        _vectors = database.GetCollection(NodeCodec.VectorCollection);
        _links = database.GetCollection(NodeCodec.LinkCollection);
        _meta = meta;
        _all = new Lazy<float[]>(LoadAllVectors);
    }

    /// <inheritdoc />
    public int Dimension => _meta.Dimension;

    /// <inheritdoc />
    public int Count => _meta.Count;

    /// <inheritdoc />
    public int LiveCount => _meta.LiveCount;

    /// <summary>The stored graph settings.</summary>
    public HnswParameters Parameters => _meta.Parameters;

    /// <summary>The embedding model the graph was built with.</summary>
    public string ModelFingerprint => _meta.ModelFingerprint;

    /// <summary>How many node vectors have been read from the file so far (shows a search did not load them all).</summary>
    public int VectorsLoaded => _all.IsValueCreated ? Count : _vectorCache.Count;

    /// <inheritdoc />
    public bool IsDeleted(int id)
    {
        GraphGuard.Id(id, Count);
        return _meta.IsDeleted(id);
    }

    /// <inheritdoc />
    public ReadOnlySpan<float> GetVector(int id)
    {
        GraphGuard.Id(id, Count);
        return VectorOf(id);
    }

    /// <inheritdoc />
    public Neighbour[] Search(ReadOnlySpan<float> query, int k, int? ef = null)
    {
        GraphGuard.Query(query.Length, Dimension, k);
        var scratch = SearchScratch.ForCurrentThread();
        var unit = scratch.NormalisedQuery(query);
        if (LiveCount <= Parameters.ExactBelow)
        {
            return ExactScan.TopK(_all.Value, DeletedFlags(), Dimension, Count, unit, k, scratch);
        }

        return HnswAlgorithm.Search(new LazyGraphView(this), _meta.Entry, unit, k, ef ?? Parameters.EfSearch, scratch);
    }

    /// <inheritdoc />
    public Neighbour[] RangeSearch(ReadOnlySpan<float> query, float radius)
    {
        GraphGuard.Query(query.Length, Dimension, 1);
        var scratch = SearchScratch.ForCurrentThread();
        var unit = scratch.NormalisedQuery(query);
        if (LiveCount <= Parameters.ExactBelow)
        {
            return ExactScan.Within(_all.Value, DeletedFlags(), Dimension, Count, unit, radius);
        }

        return HnswAlgorithm.RangeSearch(new LazyGraphView(this), _meta.Entry, unit, radius, Parameters.EfSearch, LiveCount, scratch);
    }

    internal bool IsDeletedUnchecked(int id) => _meta.IsDeleted(id);

    internal ReadOnlySpan<float> VectorOf(int id)
    {
        if (_all.IsValueCreated)
        {
            return _all.Value.AsSpan(id * Dimension, Dimension);
        }

        if (!_vectorCache.TryGetValue(id, out var vector))
        {
            vector = new float[Dimension];
            NodeCodec.ReadVector(Fetch(_vectors, id), vector);
            _vectorCache.TryAdd(id, vector);
        }

        return vector;
    }

    internal int[][] LinksOf(int id)
    {
        if (!_linkCache.TryGetValue(id, out var layers))
        {
            layers = NodeCodec.ReadLinks(Fetch(_links, id));
            _linkCache.TryAdd(id, layers);
        }

        return layers;
    }

    private BsonDocument Fetch(ILiteCollection<BsonDocument> collection, int id) =>
        collection.FindById(id) ?? throw new InvalidDataException(
            $"Graph node {id} is missing from collection {collection.Name} although the metadata counts {Count} nodes: the index is damaged; rebuild it with ingest.");

    private bool[] DeletedFlags()
    {
        var flags = new bool[Count];
        for (int id = 0; id < Count; id++)
        {
            flags[id] = _meta.IsDeleted(id);
        }

        return flags;
    }

    private float[] LoadAllVectors()
    {
        var all = new float[Count * Dimension];
        foreach (var doc in _vectors.FindAll())
        {
            int id = doc["_id"].AsInt32;
            if (id < Count)
            {
                NodeCodec.ReadVector(doc, all.AsSpan(id * Dimension, Dimension));
            }
        }

        return all;
    }
}

using System.Collections.Concurrent;
using Lookup.Embedding;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Matching;

/// <summary>
/// An index file opened for matching: a read-only snapshot (runs beside an ingest), the graph searched in place
/// (only visited nodes are read), photo records looked up per hit and cached, the verdict thresholds and the
/// catalogue settings. Thread safety: any number of concurrent readers.
/// </summary>
internal sealed class MatchIndex : IMatchCatalogue, IDisposable
{
    private readonly IndexFile _file;
    private readonly PhotoTable _photos;
    private readonly PersistedGraph _graph;
    private readonly ConcurrentDictionary<int, PhotoRecord?> _byNode = new();
    private readonly ConcurrentDictionary<string, IReadOnlyList<PhotoRecord>> _bySku = new(StringComparer.Ordinal);

    private MatchIndex(IndexFile file, PersistedGraph graph)
    {
        _file = file;
        _graph = graph;
        _photos = new PhotoTable(file);
        Settings = CatalogueSettings.Read(file);
        Thresholds = VerdictThresholds.ReadOrDefault(file);
    }

    /// <summary>Full path of the index file.</summary>
    public string Path => _file.Path;

    /// <summary>How the index was built (root, SKU mapping, model card); null if ingest never wrote it.</summary>
    public CatalogueSettings? Settings { get; }

    /// <summary>The verdict thresholds stored by calibrate, or the defaults.</summary>
    public VerdictThresholds Thresholds { get; }

    /// <summary>Indexed photos in the graph.</summary>
    public int LivePhotos => _graph.LiveCount;

    /// <summary>Graph node vectors read from the file so far (benchmarks: how much of the graph a match touched).</summary>
    internal int VectorsRead => _graph.VectorsLoaded;

    /// <summary>The fingerprint of the model the graph was built with.</summary>
    public string ModelFingerprint => _graph.ModelFingerprint;

    /// <summary>Opens <paramref name="path"/> read-only.</summary>
    /// <exception cref="IndexFileException">Missing, not an index, newer schema, no graph, or no indexed photo.</exception>
    public static MatchIndex Open(string path)
    {
        var file = IndexFile.Open(path, IndexAccess.Read);
        try
        {
            var graph = new GraphStore(file).OpenLazy();
            if (graph.LiveCount == 0)
            {
                throw new IndexFileException(file.Path, IndexFileProblem.NoGraph,
                    $"{file.Path} holds no indexed photos ({graph.Count} were indexed and all have been retired): run lookup ingest on the catalogue folder first.");
            }

            return new MatchIndex(file, graph);
        }
        catch
        {
            file.Dispose();
            throw;
        }
    }

    /// <summary>Refuses an embedder whose model differs from the one the index was built with, naming both.</summary>
    /// <exception cref="IndexFileException">With <see cref="IndexFileProblem.ModelMismatch"/>.</exception>
    public void RequireModel(ImageEmbedder embedder)
    {
        ArgumentNullException.ThrowIfNull(embedder);
        if (embedder.Fingerprint == ModelFingerprint && embedder.Dimension == _graph.Dimension)
        {
            return;
        }

        string builtWith = Settings is null ? "another model" : $"model card '{CardName(Settings.ModelCardJson)}'";
        throw new IndexFileException(Path, IndexFileProblem.ModelMismatch,
            $"{Path} was built with {builtWith} (fingerprint {Short(ModelFingerprint)}, {_graph.Dimension} floats), this run uses " +
            $"model card '{embedder.Card.Name}' (fingerprint {Short(embedder.Fingerprint)}, {embedder.Dimension} floats): pass --model with " +
            "the card the index was built with, or ingest the catalogue into a new index with this model.");
    }

    /// <summary>The record of a catalogue photo by its relative path ('/' separated), or null.</summary>
    public PhotoRecord? FindPhoto(string relativePath) => _photos.Find(relativePath);

    public Neighbour[] Nearest(ReadOnlySpan<float> vector, int k) => _graph.Search(vector, k, Math.Max(k, _graph.Parameters.EfSearch));

    public PhotoRecord? PhotoAt(int node) => _byNode.GetOrAdd(node, n => _photos.FindByNode(n) is { Status: PhotoStatus.Indexed } r ? r : null);

    public IReadOnlyList<PhotoRecord> PhotosOf(string sku) => _bySku.GetOrAdd(sku, s => [.. _photos.FindBySku(s).Where(IsLive)]);

    public IReadOnlyList<PhotoRecord> PhotosWithContent(string sha256) => [.. _photos.FindBySha256(sha256).Where(IsLive)];

    public ReadOnlySpan<float> Vector(int node) => _graph.GetVector(node);

    public void Dispose() => _file.Dispose();

    private bool IsLive(PhotoRecord r) =>
        r.Status == PhotoStatus.Indexed && r.NodeId is int node && node < _graph.Count && !_graph.IsDeleted(node);

    private static string Short(string fingerprint) => fingerprint.Length > 12 ? fingerprint[..12] + "…" : fingerprint;

    private static string CardName(string cardJson)
    {
        try
        {
            return ModelCard.FromJson(cardJson, Environment.CurrentDirectory).Name;
        }
        catch (ModelLoadException)
        {
            return "unknown";
        }
    }
}

using LiteDB;
using Lookup.Embedding;
using Lookup.Graph;
using Lookup.Store;
using Lookup.Tests.Graph;

namespace Lookup.Tests.Store;

/// <summary>
/// A small index written through the store API as ingest writes it (photo records, graph nodes, catalogue settings
/// with the built-in model card and its real fingerprint), with helpers that damage it on purpose through LiteDB.
/// Vectors are invented (clustered Gaussian, fixed seed): the checks are about structure, not about photos.
/// </summary>
internal sealed class CheckedIndex : IDisposable
{
    public const int Photos = 60;
    public const int Dimension = 16;

    private static readonly Lazy<string> DefaultFingerprint = new(() => ModelFingerprint.Compute(ModelCard.Default));

    private readonly TempIndex _temp = new();

    public CheckedIndex(int photos = Photos)
    {
        Vectors = SyntheticVectors.Clustered(photos, Dimension, clusters: 6, spread: 0.3, seed: 2026);
        using var file = IndexFile.Open(Path, IndexAccess.Write);
        var store = new GraphStore(file);
        var graph = store.Create(Dimension, new HnswParameters(M: 4, ExactBelow: 0), Fingerprint);
        var table = new PhotoTable(file);
        file.InTransaction(() =>
        {
            new CatalogueSettings("/catalogue", "folder", ModelCard.Default.ToJson(), Fingerprint, DateTime.UnixEpoch).Write(file);
            for (int i = 0; i < photos; i++)
            {
                table.Upsert(Record(PathOf(i), graph.Add(Vectors[i])));
            }

            store.Commit(graph);
        });
    }

    public static string Fingerprint => DefaultFingerprint.Value;

    public string Path => _temp.Path;

    public float[][] Vectors { get; }

    public static string PathOf(int photo) => $"S-{photo % 5}/{photo:000}.jpg";

    public static PhotoRecord Record(string path, int? node) => new()
    {
        Path = path,
        Sku = path[..3],
        Size = 1000,
        Sha256 = Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(path))),
        Status = PhotoStatus.Indexed,
        NodeId = node,
        Width = 100,
        Height = 100,
        Format = "JPEG",
        UpdatedUtc = DateTime.UnixEpoch,
    };

    /// <summary>Changes the file through the writer: the graph (loaded) and the photo table, committed together.</summary>
    public void Change(Action<HnswGraph, PhotoTable> change)
    {
        using var file = IndexFile.Open(Path, IndexAccess.Write);
        var store = new GraphStore(file);
        var graph = store.Load();
        var table = new PhotoTable(file);
        file.InTransaction(() =>
        {
            change(graph, table);
            store.Commit(graph);
        });
    }

    /// <summary>Edits raw LiteDB documents, bypassing every rule the store keeps.</summary>
    public void Raw(Action<LiteDatabase> edit)
    {
        using var file = IndexFile.Open(Path, IndexAccess.Write);
        file.InTransaction(() => edit(file.Database));
    }

    public PhotoRecord RecordOf(int photo)
    {
        using var file = IndexFile.Open(Path, IndexAccess.Read);
        return new PhotoTable(file).Find(PathOf(photo))!;
    }

    /// <summary>Checks the index; hashing the model files (about 45 MB) only when a test is about the model.</summary>
    public IndexCheckReport Check(bool verifyModelFiles = false)
    {
        using var file = IndexFile.Open(Path, IndexAccess.Read);
        return IndexChecker.Check(file, verifyModelFiles);
    }

    public IndexRepairResult Repair(Action? beforeGraphWrite = null, bool verifyModelFiles = false)
    {
        using var file = IndexFile.Open(Path, IndexAccess.Write);
        return IndexChecker.Repair(file, verifyModelFiles, beforeGraphWrite);
    }

    public void Dispose() => _temp.Dispose();
}

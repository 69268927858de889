using System.Security.Cryptography;
using System.Text;
using Lookup.Embedding;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Tests.Catalogue;

/// <summary>A photo of a synthetic part index: its record (node id is assigned on write) and its vector.</summary>
internal sealed record PartPhoto(PhotoRecord Record, float[]? Vector);

/// <summary>How a synthetic part was "ingested"; each field can be changed to make a part that must be refused.</summary>
internal sealed record PartBasis
{
    public string Root { get; init; } = "/srv/catalogue";
    public string SkuMapping { get; init; } = "folder";
    public string Fingerprint { get; init; } = "fp-synthetic-0001";
    public int Dimension { get; init; } = MergeTestParts.Dimension;
    public HnswParameters Graph { get; init; } = new();
}

/// <summary>
/// Writes part indexes the way ingest leaves them (catalogue settings, graph, photo records pointing at nodes)
/// from invented records and fixed-seed random vectors, so merge tests run in milliseconds without a model.
/// </summary>
internal static class MergeTestParts
{
    public const int Dimension = 16;

    public static readonly DateTime Day1 = new(2026, 3, 1, 8, 0, 0, DateTimeKind.Utc);

    /// <summary>Photos <paramref name="first"/>.. of a catalogue, each with its own seeded vector.</summary>
    public static List<PartPhoto> Photos(int first, int count, DateTime? updated = null) =>
        [.. Enumerable.Range(first, count).Select(i => Photo(i, updated ?? Day1))];

    public static PartPhoto Photo(int i, DateTime updated, int contentVersion = 0) => new(
        new PhotoRecord
        {
            Path = PathOf(i),
            Sku = $"SKU-{i % 97:D3}",
            Size = 10_000 + i + contentVersion,
            MtimeUtcTicks = updated.Ticks,
            Sha256 = Sha(i, contentVersion),
            Status = PhotoStatus.Indexed,
            Width = 640,
            Height = 480,
            Format = "JPEG",
            DHash = (ulong)i * 0x9E3779B97F4A7C15UL,
            Thumbnail = [.. Enumerable.Range(0, 16).Select(b => (byte)(i + b + contentVersion))],
            UpdatedUtc = updated,
        },
        Vector(i, contentVersion));

    public static PartPhoto Failed(int i, DateTime updated, int contentVersion = 0)
    {
        var photo = Photo(i, updated, contentVersion);
        return new PartPhoto(
            photo.Record with
            {
                Status = PhotoStatus.Failed,
                Width = 0,
                Height = 0,
                Thumbnail = null,
                FailureReason = "Truncated",
                FailureMessage = $"{PathOf(i)} ends before its last JPEG marker: the file is cut short; copy it again.",
            },
            null);
    }

    public static string PathOf(int i) => $"sku-{i % 97:D3}/photo-{i:D5}.jpg";

    public static string Sha(int i, int contentVersion = 0) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes($"photo {i} version {contentVersion}")));

    public static float[] Vector(int i, int contentVersion = 0)
    {
        var random = new Random((i * 7919) + (contentVersion * 104_729) + 1);
        var v = new float[Dimension];
        for (int d = 0; d < v.Length; d++)
        {
            v[d] = (float)((random.NextDouble() * 2) - 1);
        }

        float norm = MathF.Sqrt(v.Sum(x => x * x));
        return [.. v.Select(x => x / norm)];
    }

    /// <summary>Writes a part; <paramref name="retiredFirst"/> nodes are added and deleted first, so the part's node
    /// ids are not the target's and its graph has tombstones, as after an ingest that saw changed photos.</summary>
    public static string Write(string path, IEnumerable<PartPhoto> photos, PartBasis? basis = null, int retiredFirst = 0)
    {
        basis ??= new PartBasis();
        using var file = IndexFile.Open(path, IndexAccess.Write);
        var store = new GraphStore(file);
        var table = new PhotoTable(file);
        file.InTransaction(() =>
        {
            var graph = store.Create(basis.Dimension, basis.Graph, basis.Fingerprint);
            var junk = new Random(99);
            for (int i = 0; i < retiredFirst; i++)
            {
                graph.Delete(graph.Add([.. Enumerable.Range(0, basis.Dimension).Select(_ => (float)junk.NextDouble() + 0.1f)]));
            }

            foreach (var photo in photos)
            {
                int? node = photo.Vector is null ? null : graph.Add(Resize(photo.Vector, basis.Dimension));
                table.Upsert(photo.Record with { NodeId = node });
            }

            new CatalogueSettings(basis.Root, basis.SkuMapping, ModelCard.Default.ToJson(), basis.Fingerprint, Day1).Write(file);
            store.Commit(graph);
        });
        return file.Path;
    }

    /// <summary>Every record of an index by path, and its graph loaded into memory (null when it has none).</summary>
    public static (Dictionary<string, PhotoRecord> Records, HnswGraph? Graph) Read(string path)
    {
        using var file = IndexFile.Open(path, IndexAccess.Read);
        var records = new PhotoTable(file).All().ToDictionary(r => r.Path, StringComparer.Ordinal);
        var store = new GraphStore(file);
        return (records, store.HasGraph ? store.Load() : null);
    }

    private static float[] Resize(float[] vector, int dimension) =>
        vector.Length == dimension ? vector : [.. Enumerable.Range(0, dimension).Select(d => vector[d % vector.Length])];
}

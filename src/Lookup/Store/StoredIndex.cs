using System.Runtime.InteropServices;
using LiteDB;

namespace Lookup.Store;

/// <summary>
/// Everything <see cref="IndexChecker"/> needs from an index file, read document by document without trusting any
/// of it: a record, vector or link list that cannot be decoded is set aside by id instead of stopping the read.
/// </summary>
internal sealed class StoredIndex
{
    private const int MaxLevel = 30;

    /// <summary>Photo records that decode, in path order.</summary>
    public List<PhotoRecord> Records { get; } = [];

    /// <summary>Keys of photo documents that do not decode, with the reason.</summary>
    public List<(BsonValue Id, string Problem)> DamagedRecords { get; } = [];

    /// <summary>The graph metadata, or null when missing or damaged.</summary>
    public GraphMeta? Meta { get; private set; }

    /// <summary>Why <see cref="Meta"/> is null although a metadata document exists.</summary>
    public string? MetaProblem { get; private set; }

    /// <summary>Embedding length: the metadata's, else the most common vector length, else 0.</summary>
    public int Dimension { get; private set; }

    /// <summary>Vectors that decode, are <see cref="Dimension"/> long, finite and of unit length, by node id.</summary>
    public Dictionary<int, float[]> Vectors { get; } = [];

    /// <summary>Vector documents that fail those tests, with the reason.</summary>
    public SortedDictionary<int, string> DamagedVectors { get; } = [];

    /// <summary>Link lists that decode (per layer, ids only), by node id.</summary>
    public Dictionary<int, int[][]> Links { get; } = [];

    /// <summary>Link documents that do not decode, with the reason.</summary>
    public SortedDictionary<int, string> DamagedLinks { get; } = [];

    /// <summary>The catalogue settings, or null when missing or damaged.</summary>
    public CatalogueSettings? Settings { get; private set; }

    /// <summary>Why <see cref="Settings"/> is null although a settings document exists.</summary>
    public string? SettingsProblem { get; private set; }

    public static StoredIndex Read(IndexFile file)
    {
        var stored = new StoredIndex();
        var db = file.Database;
        foreach (var doc in All(db, PhotoTable.CollectionName))
        {
            try
            {
                stored.Records.Add(PhotoTable.FromBson(doc));
            }
            catch (Exception e) when (IsDecodeError(e))
            {
                stored.DamagedRecords.Add((doc["_id"], e.Message));
            }
        }

        stored.Records.Sort((a, b) => string.CompareOrdinal(a.Path, b.Path));
        stored.ReadMeta(db);
        stored.ReadSettings(file);
        var rawVectors = All(db, NodeCodec.VectorCollection).Select(d => (Id: d["_id"], Bytes: d["v"])).ToList();
        stored.Dimension = stored.Meta?.Dimension ?? MostCommonLength(rawVectors.Select(v => v.Bytes));
        foreach (var (id, bytes) in rawVectors)
        {
            if (!id.IsInt32)
            {
                continue;
            }

            if (VectorProblem(bytes, stored.Dimension) is { } problem)
            {
                stored.DamagedVectors[id.AsInt32] = problem;
            }
            else
            {
                stored.Vectors[id.AsInt32] = MemoryMarshal.Cast<byte, float>(bytes.AsBinary).ToArray();
            }
        }

        int m = stored.Meta?.Parameters.M ?? new Graph.HnswParameters().M;
        foreach (var doc in All(db, NodeCodec.LinkCollection))
        {
            if (!doc["_id"].IsInt32)
            {
                continue;
            }

            int id = doc["_id"].AsInt32;
            if (DecodeLinks(doc, m, out var layers) is { } problem)
            {
                stored.DamagedLinks[id] = problem;
            }
            else
            {
                stored.Links[id] = layers!;
            }
        }

        return stored;
    }

    private void ReadMeta(LiteDatabase db)
    {
        var doc = db.CollectionExists(GraphStore.MetaCollection) ? db.GetCollection(GraphStore.MetaCollection).FindById(GraphMeta.Id) : null;
        if (doc is null)
        {
            return;
        }

        try
        {
            var meta = GraphMeta.FromBson(doc);
            meta.Parameters.Validate();
            if (meta.Dimension <= 0 || meta.Count < 0 || meta.DeletedBits.Length < (meta.Count + 7) / 8
                || meta.Count > db.GetCollection(NodeCodec.VectorCollection).Count() + db.GetCollection(NodeCodec.LinkCollection).Count() + 1024)
            {
                MetaProblem = $"dimension {meta.Dimension}, {meta.Count} nodes and {meta.DeletedBits.Length} bytes of retirement flags do not fit together or with the node documents";
                return;
            }

            Meta = meta;
        }
        catch (Exception e) when (IsDecodeError(e) || e is ArgumentException)
        {
            MetaProblem = e.Message;
        }
    }

    private void ReadSettings(IndexFile file)
    {
        try
        {
            Settings = CatalogueSettings.Read(file);
        }
        catch (Exception e) when (IsDecodeError(e))
        {
            SettingsProblem = e.Message;
        }
    }

    private static IEnumerable<BsonDocument> All(LiteDatabase db, string collection) =>
        db.CollectionExists(collection) ? db.GetCollection(collection).FindAll() : [];

    private static string? VectorProblem(BsonValue bytes, int dimension)
    {
        if (!bytes.IsBinary)
        {
            return "not a binary value";
        }

        if (bytes.AsBinary.Length != dimension * sizeof(float))
        {
            return $"{bytes.AsBinary.Length} bytes, expected {dimension * sizeof(float)} ({dimension} floats)";
        }

        double squares = 0;
        foreach (float x in MemoryMarshal.Cast<byte, float>(bytes.AsBinary))
        {
            if (!float.IsFinite(x))
            {
                return "holds a value that is not a finite number";
            }

            squares += (double)x * x;
        }

        // Vectors are normalised once at insert; float rounding keeps the squared norm within about 1e-6 of 1.
        return Math.Abs(squares - 1) > 1e-3 ? $"length {Math.Sqrt(squares):0.####}, expected 1 (vectors are stored normalised)" : null;
    }

    private static string? DecodeLinks(BsonDocument doc, int m, out int[][]? layers)
    {
        layers = null;
        if (!doc["l"].IsBinary || !doc["lv"].IsInt32)
        {
            return "the level or the link bytes are missing";
        }

        var bytes = doc["l"].AsBinary;
        int level = doc["lv"].AsInt32;
        if (bytes.Length % sizeof(int) != 0 || level is < 0 or > MaxLevel)
        {
            return $"level {level} and {bytes.Length} link bytes cannot be a link list";
        }

        var ints = MemoryMarshal.Cast<byte, int>(bytes);
        var result = new int[level + 1][];
        int at = 0;
        for (int lc = 0; lc <= level; lc++)
        {
            int max = lc == 0 ? 2 * m : m;
            int count = at < ints.Length ? ints[at++] : -1;
            if (count < 0 || count > max || at + count > ints.Length)
            {
                return $"layer {lc} claims {count} links (allowed 0..{max}) in {ints.Length} stored numbers";
            }

            result[lc] = ints.Slice(at, count).ToArray();
            at += count;
        }

        if (at != ints.Length)
        {
            return $"{ints.Length - at} numbers left over after {level + 1} layers";
        }

        layers = result;
        return null;
    }

    private static int MostCommonLength(IEnumerable<BsonValue> vectors) =>
        vectors.Where(v => v.IsBinary && v.AsBinary.Length % sizeof(float) == 0 && v.AsBinary.Length > 0)
            .GroupBy(v => v.AsBinary.Length / sizeof(float))
            .OrderByDescending(g => g.Count())
            .ThenBy(g => g.Key)
            .Select(g => g.Key)
            .FirstOrDefault();

    private static bool IsDecodeError(Exception e) =>
        e is InvalidCastException or KeyNotFoundException or ArgumentException or FormatException or NullReferenceException or LiteException or OverflowException;
}

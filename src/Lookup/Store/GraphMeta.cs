using System.Collections;
using LiteDB;
using Lookup.Graph;

namespace Lookup.Store;

/// <summary>The graph's metadata document: settings, counts, entry point, model fingerprint and the tombstone bitmap.</summary>
internal sealed record GraphMeta(
    int Dimension,
    HnswParameters Parameters,
    int Count,
    int LiveCount,
    EntryPoint Entry,
    string ModelFingerprint,
    byte[] DeletedBits)
{
    public const string Id = "graph";

    public bool IsDeleted(int id) => (DeletedBits[id >> 3] & (1 << (id & 7))) != 0;

    public static byte[] Bits(ReadOnlySpan<bool> deleted)
    {
        var bits = new BitArray(deleted.Length);
        for (int i = 0; i < deleted.Length; i++)
        {
            bits[i] = deleted[i];
        }

        var bytes = new byte[(deleted.Length + 7) / 8];
        bits.CopyTo(bytes, 0);
        return bytes;
    }

    public BsonDocument ToBson() => new()
    {
        ["_id"] = Id,
        ["dimension"] = Dimension,
        ["m"] = Parameters.M,
        ["efConstruction"] = Parameters.EfConstruction,
        ["efSearch"] = Parameters.EfSearch,
        ["seed"] = Parameters.Seed,
        ["keepPruned"] = Parameters.KeepPrunedConnections,
        ["exactBelow"] = Parameters.ExactBelow,
        ["count"] = Count,
        ["live"] = LiveCount,
        ["entry"] = Entry.Id,
        ["entryLevel"] = Entry.Level,
        ["model"] = ModelFingerprint,
        ["deleted"] = DeletedBits,
    };

    public static GraphMeta FromBson(BsonDocument doc)
    {
        var parameters = new HnswParameters(
            doc["m"].AsInt32,
            doc["efConstruction"].AsInt32,
            doc["efSearch"].AsInt32,
            doc["seed"].AsInt32,
            doc["keepPruned"].AsBoolean,
            doc["exactBelow"].AsInt32);
        return new GraphMeta(
            doc["dimension"].AsInt32,
            parameters,
            doc["count"].AsInt32,
            doc["live"].AsInt32,
            new EntryPoint(doc["entry"].AsInt32, doc["entryLevel"].AsInt32),
            doc["model"].AsString,
            doc["deleted"].AsBinary);
    }
}

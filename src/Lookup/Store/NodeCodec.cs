using System.Runtime.InteropServices;
using LiteDB;
using Lookup.Graph;

namespace Lookup.Store;

/// <summary>
/// Node documents. A node's vector and its links live in two collections: the vector (2 KB at 512 floats) is
/// written once, while links change whenever a neighbour is inserted or deleted, so a batch rewrites only small
/// link documents. Links are one byte array per node: for each layer 0..level, a count then the ids (int32 LE).
/// </summary>
internal static class NodeCodec
{
    public const string VectorCollection = "graph_vectors";
    public const string LinkCollection = "graph_links";

    public static BsonDocument VectorDocument(int id, ReadOnlySpan<float> vector) => new()
    {
        ["_id"] = id,
        ["v"] = MemoryMarshal.AsBytes(vector).ToArray(),
    };

    public static BsonDocument LinkDocument(GraphState state, int id)
    {
        int level = state.Levels[id];
        var ints = new List<int>();
        for (int lc = 0; lc <= level; lc++)
        {
            var row = state.Row(id, lc);
            int count = row[0];
            ints.Add(count);
            foreach (int e in row.Slice(1, count))
            {
                ints.Add(e);
            }
        }

        return new BsonDocument
        {
            ["_id"] = id,
            ["lv"] = level,
            ["l"] = MemoryMarshal.AsBytes(CollectionsMarshal.AsSpan(ints)).ToArray(),
        };
    }

    public static void ReadVector(BsonDocument doc, Span<float> destination) =>
        MemoryMarshal.Cast<byte, float>(doc["v"].AsBinary).CopyTo(destination);

    /// <summary>The node's links per layer, ids only.</summary>
    public static int[][] ReadLinks(BsonDocument doc)
    {
        var ints = MemoryMarshal.Cast<byte, int>(doc["l"].AsBinary);
        var layers = new int[doc["lv"].AsInt32 + 1][];
        int at = 0;
        for (int lc = 0; lc < layers.Length; lc++)
        {
            int count = ints[at++];
            layers[lc] = ints.Slice(at, count).ToArray();
            at += count;
        }

        return layers;
    }

    /// <summary>Fills the node's level and rows in <paramref name="state"/>.</summary>
    public static void ReadLinks(BsonDocument doc, GraphState state, int id) => SetLinks(ReadLinks(doc), state, id);

    /// <summary>Sets node <paramref name="id"/>'s level and rows in <paramref name="state"/> from its links per layer.</summary>
    public static void SetLinks(int[][] layers, GraphState state, int id)
    {
        int level = layers.Length - 1;
        state.Levels[id] = (byte)level;
        state.Upper[id] = level > 0 ? new int[level * state.StrideUpper] : null;
        for (int lc = 0; lc <= level; lc++)
        {
            var row = state.Row(id, lc);
            row[0] = layers[lc].Length;
            layers[lc].CopyTo(row[1..]);
        }
    }
}

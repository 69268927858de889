namespace Lookup.Graph;

/// <summary>Argument checks of the public entry points, kept out of line so the callers stay small.</summary>
internal static class GraphGuard
{
    public static void Dimension(int length, int dimension)
    {
        if (length != dimension)
        {
            throw new ArgumentException($"The vector has {length} floats but this index holds {dimension}-dimensional vectors: embed with the model the index was built with.", "vector");
        }
    }

    public static void Id(int id, int count)
    {
        if ((uint)id >= (uint)count)
        {
            throw new ArgumentOutOfRangeException(nameof(id), id, $"Node id {id} is outside 0..{count - 1}: ids come from Add.");
        }
    }

    public static void Query(int length, int dimension, int k)
    {
        if (length != dimension)
        {
            throw new ArgumentException($"The query has {length} floats but this index holds {dimension}-dimensional vectors: embed the query with the model the index was built with.", "query");
        }

        ArgumentOutOfRangeException.ThrowIfNegative(k);
    }
}

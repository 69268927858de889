namespace Lookup.Graph;

/// <summary>
/// The arrays of one capacity generation of an <see cref="HnswGraph"/>. Growing allocates a new state, copies
/// and publishes it; a reader that took the old state keeps a consistent (older) picture, because the writer
/// never writes into a state after replacing it.
/// </summary>
internal sealed class GraphState
{
    public GraphState(int dimension, int m, int capacity)
    {
        Dimension = dimension;
        M = m;
        Capacity = capacity;
        Stride0 = (2 * m) + 1;
        Vectors = new float[(long)capacity * dimension];
        Links0 = new int[(long)capacity * Stride0];
        Levels = new byte[capacity];
        Upper = new int[]?[capacity];
        Deleted = new bool[capacity];
        InDegree0 = new int[capacity];
    }

    public int Dimension { get; }

    public int M { get; }

    public int Capacity { get; }

    /// <summary>Ints per node on layer 0: a count, then up to MaxM0 ids.</summary>
    public int Stride0 { get; }

    /// <summary>Ints per node and upper layer: a count, then up to M ids.</summary>
    public int StrideUpper => M + 1;

    /// <summary>Unit vectors, node after node, stride <see cref="Dimension"/>.</summary>
    public float[] Vectors { get; }

    /// <summary>Layer-0 link lists at fixed stride <see cref="Stride0"/>.</summary>
    public int[] Links0 { get; }

    /// <summary>Top layer of each node.</summary>
    public byte[] Levels { get; }

    /// <summary>Layers 1..level of each node (null for level 0): <see cref="StrideUpper"/> ints per layer. Sparse, as few nodes reach them.</summary>
    public int[]?[] Upper { get; }

    /// <summary>Tombstones.</summary>
    public bool[] Deleted { get; }

    /// <summary>How many live nodes link to each node on layer 0 (writer bookkeeping to catch nodes a write would orphan).</summary>
    public int[] InDegree0 { get; }

    /// <summary>The count-then-ids row of <paramref name="id"/> on <paramref name="level"/>, or an empty span when the node has no such layer.</summary>
    public Span<int> Row(int id, int level)
    {
        if (level == 0)
        {
            return Links0.AsSpan(id * Stride0, Stride0);
        }

        var upper = Upper[id];
        int offset = (level - 1) * StrideUpper;
        return upper is null || upper.Length < offset + StrideUpper ? default : upper.AsSpan(offset, StrideUpper);
    }

    /// <summary>A copy of this state with room for <paramref name="capacity"/> nodes.</summary>
    public GraphState Grow(int capacity, int used)
    {
        var grown = new GraphState(Dimension, M, capacity);
        Array.Copy(Vectors, grown.Vectors, (long)used * Dimension);
        Array.Copy(Links0, grown.Links0, (long)used * Stride0);
        Array.Copy(Levels, grown.Levels, used);
        // Upper rows are copied, not shared: the writer keeps editing the new state's rows, and a reader still on
        // this state must never meet an id beyond this state's capacity.
        for (int id = 0; id < used; id++)
        {
            grown.Upper[id] = (int[]?)Upper[id]?.Clone();
        }

        Array.Copy(Deleted, grown.Deleted, used);
        Array.Copy(InDegree0, grown.InDegree0, used);
        return grown;
    }
}

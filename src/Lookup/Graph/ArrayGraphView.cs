using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics.X86;

namespace Lookup.Graph;

/// <summary>The in-memory storage seen through <see cref="IGraphView"/>: spans over the arrays of one <see cref="GraphState"/>.</summary>
internal readonly struct ArrayGraphView(GraphState state) : IGraphView
{
    public int NodeLimit => state.Capacity;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public ReadOnlySpan<float> Vector(int id) => state.Vectors.AsSpan(id * state.Dimension, state.Dimension);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public ReadOnlySpan<int> Links(int id, int level)
    {
        var row = state.Row(id, level);
        if (row.IsEmpty)
        {
            return default;
        }

        // The writer stores ids before the count, so a concurrent reader sees valid ids; clamp a torn count.
        int count = Math.Clamp(Volatile.Read(ref row[0]), 0, row.Length - 1);
        return row.Slice(1, count);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool IsDeleted(int id) => state.Deleted[id];

    /// <summary>
    /// Asks the CPU to start loading the first cache lines of a vector while the current distance is computed
    /// (hnswlib does the same): at 100k × 512 floats the vectors far exceed the caches. A prefetch never faults,
    /// and vector arrays live on the large-object heap, which is not compacted, so the address stays good.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public unsafe void Prefetch(int id)
    {
        if (Sse.IsSupported)
        {
            byte* p = (byte*)Unsafe.AsPointer(ref state.Vectors[id * state.Dimension]);
            Sse.Prefetch0(p);
            Sse.Prefetch0(p + 64);
            Sse.Prefetch0(p + 128);
            Sse.Prefetch0(p + 192);
        }
    }
}

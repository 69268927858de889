using System.Runtime.CompilerServices;
using Lookup.Graph;

namespace Lookup.Store;

/// <summary>The persisted graph seen through <see cref="IGraphView"/>: nodes are fetched from the file on first touch and cached.</summary>
internal readonly struct LazyGraphView(PersistedGraph graph) : IGraphView
{
    public int NodeLimit => graph.Count;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public ReadOnlySpan<float> Vector(int id) => graph.VectorOf(id);

    public ReadOnlySpan<int> Links(int id, int level)
    {
        var layers = graph.LinksOf(id);
        return level < layers.Length ? layers[level] : default;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool IsDeleted(int id) => graph.IsDeletedUnchecked(id);

    public void Prefetch(int id)
    {
    }
}

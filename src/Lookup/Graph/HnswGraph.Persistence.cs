namespace Lookup.Graph;

/// <summary>Hooks the index file (Store/) uses to save changed nodes and to rebuild a graph from saved arrays.</summary>
public sealed partial class HnswGraph
{
    /// <summary>Starts recording the ids of nodes whose vector, links or tombstone change (writer only).</summary>
    internal void TrackChanges() => _dirty ??= [];

    /// <summary>The ids changed since the last call, ascending, and forgets them (writer only).</summary>
    internal int[] TakeChanged()
    {
        if (_dirty is null || _dirty.Count == 0)
        {
            return [];
        }

        var ids = _dirty.ToArray();
        Array.Sort(ids);
        _dirty.Clear();
        return ids;
    }

    /// <summary>Records <paramref name="ids"/> as changed again (a commit that failed).</summary>
    internal void Remark(IEnumerable<int> ids)
    {
        foreach (int id in ids)
        {
            MarkDirty(id);
        }
    }

    /// <summary>
    /// A graph over arrays filled by a loader. The level generator is reseeded from the seed and the node count,
    /// so a reopened graph keeps drawing reproducible levels.
    /// </summary>
    internal static HnswGraph Restore(int dimension, HnswParameters parameters, GraphState state, int count, EntryPoint entry)
    {
        var graph = new HnswGraph(dimension, parameters, 16, seedOffset: count)
        {
            _state = state,
            _count = count,
            _entry = entry.IsNone ? -1 : entry.Pack(),
        };
        int live = 0;
        for (int id = 0; id < count; id++)
        {
            if (!state.Deleted[id])
            {
                live++;
                foreach (int e in new ArrayGraphView(state).Links(id, 0))
                {
                    state.InDegree0[e]++;
                }
            }
        }

        graph._live = live;
        return graph;
    }
}

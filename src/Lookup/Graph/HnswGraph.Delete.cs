namespace Lookup.Graph;

/// <summary>Deletion by tombstone with neighbour repair. Writer only.</summary>
public sealed partial class HnswGraph
{
    /// <inheritdoc />
    /// <remarks>
    /// The node stays in the arrays as a tombstone that searches walk through but never return. Each live
    /// neighbour that linked back to it gets its list rebuilt by the heuristic from its other links plus the
    /// deleted node's links, so the region stays connected. If it was the entry point, the live node with the
    /// highest layer takes over. Writer only (see the type's thread-safety rule).
    /// </remarks>
    public void Delete(int id)
    {
        GraphGuard.Id(id, _count);
        var state = _state;
        if (state.Deleted[id])
        {
            return;
        }

        state.Deleted[id] = true;
        Volatile.Write(ref _live, _live - 1);
        MarkDirty(id);
        var view = new ArrayGraphView(state);
        foreach (int e in view.Links(id, 0))
        {
            if (--state.InDegree0[e] == 0 && !state.Deleted[e])
            {
                _orphans.Add(e);
            }
        }

        for (int lc = 0; lc <= state.Levels[id]; lc++)
        {
            foreach (int n in view.Links(id, lc))
            {
                if (!state.Deleted[n] && view.Links(n, lc).Contains(id))
                {
                    RepairLinks(state, n, lc, id);
                }
            }
        }

        if (Entry.Id == id)
        {
            Volatile.Write(ref _entry, FindEntryPoint(state).Pack());
        }

        if (Entry.IsNone)
        {
            _orphans.Clear();
        }
        else
        {
            ReattachOrphans(state);
        }
    }

    private void RepairLinks(GraphState state, int node, int lc, int removed)
    {
        MarkDirty(node);
        var view = new ArrayGraphView(state);
        var nodeVector = view.Vector(node);
        int n = 0;
        foreach (int e in view.Links(node, lc))
        {
            n = AddRepairCandidate(state, node, removed, e, nodeVector, n);
        }

        foreach (int e in view.Links(removed, lc))
        {
            n = AddRepairCandidate(state, node, removed, e, nodeVector, n);
        }

        ShrinkRow(state, node, lc, _candidates.AsSpan(0, n));
    }

    private int AddRepairCandidate(GraphState state, int node, int removed, int e, ReadOnlySpan<float> nodeVector, int n)
    {
        if (e == node || e == removed || state.Deleted[e])
        {
            return n;
        }

        for (int i = 0; i < n; i++)
        {
            if (_candidates[i].Id == e)
            {
                return n;
            }
        }

        _candidates[n] = new Neighbour(e, CosineKernel.Distance(nodeVector, state.Vectors.AsSpan(e * Dimension, Dimension)));
        return n + 1;
    }

    /// <summary>The live node with the highest layer (lowest id on ties), or none.</summary>
    private EntryPoint FindEntryPoint(GraphState state)
    {
        var best = EntryPoint.None;
        for (int id = 0; id < _count; id++)
        {
            if (!state.Deleted[id] && state.Levels[id] > best.Level)
            {
                best = new EntryPoint(id, state.Levels[id]);
            }
        }

        return best;
    }
}

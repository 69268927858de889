namespace Lookup.Graph;

/// <summary>Insertion: the paper's Algorithm 1 (INSERT) with Algorithm 4 (SELECT-NEIGHBORS-HEURISTIC). Writer only.</summary>
public sealed partial class HnswGraph
{
    /// <inheritdoc />
    /// <remarks>Writer only (see the type's thread-safety rule).</remarks>
    public int Add(ReadOnlySpan<float> vector)
    {
        GraphGuard.Dimension(vector.Length, Dimension);
        int id = _count;
        var state = EnsureCapacity(id + 1);
        CosineKernel.Normalize(vector, state.Vectors.AsSpan(id * Dimension, Dimension));
        int level = DrawLevel();
        state.Levels[id] = (byte)level;
        state.Upper[id] = level > 0 ? new int[level * state.StrideUpper] : null;
        MarkDirty(id);

        var entry = Entry;
        if (!entry.IsNone)
        {
            InsertLinks(state, id, level, entry);
            ReattachOrphans(state);
        }

        Volatile.Write(ref _live, _live + 1);
        Volatile.Write(ref _count, id + 1);
        if (entry.IsNone || level > entry.Level)
        {
            Volatile.Write(ref _entry, new EntryPoint(id, level).Pack());
        }

        return id;
    }

    /// <summary>Draws the new node's top layer: ⌊−ln(U(0,1)) · mL⌋ with mL = 1/ln M.</summary>
    private int DrawLevel()
    {
        double u = _random.NextDouble();
        return Math.Min((int)(-Math.Log(1.0 - u) * _parameters.LevelMultiplier), LevelCap);
    }

    private void InsertLinks(GraphState state, int id, int level, EntryPoint entry)
    {
        var view = new ArrayGraphView(state);
        var q = view.Vector(id);
        var ep = new Neighbour(entry.Id, CosineKernel.Distance(q, view.Vector(entry.Id)));
        if (entry.Level > level)
        {
            ep = HnswAlgorithm.GreedyDescent(view, q, ep, entry.Level, level + 1);
        }

        var scratch = SearchScratch.ForCurrentThread();
        Neighbour[] entryPoints = [ep];
        for (int lc = Math.Min(level, entry.Level); lc >= 0; lc--)
        {
            HnswAlgorithm.SearchLayer(view, q, entryPoints, _parameters.EfConstruction, lc, scratch);
            if (scratch.Results.Count == 0)
            {
                // Every node reached on this layer is a tombstone: keep descending from the same entry points.
                continue;
            }

            var w = scratch.TakeClosest(int.MaxValue);
            ConnectNewNode(state, id, lc, w);
            entryPoints = w;
        }
    }

    /// <summary>
    /// Links <paramref name="id"/> to the heuristic's choice of M among <paramref name="w"/> (closest first) on
    /// layer <paramref name="lc"/>, and adds the reverse link to each chosen neighbour, shrinking its list with
    /// the same heuristic when it would exceed M (M_max0 on layer 0).
    /// </summary>
    private void ConnectNewNode(GraphState state, int id, int lc, ReadOnlySpan<Neighbour> w)
    {
        int chosen = SelectNeighboursHeuristic(state, w, _parameters.M, _selected);
        var row = state.Row(id, lc);
        SetRow(state, id, lc, _selected.AsSpan(0, chosen));

        // Read the new node's own row back: _selected is reused when a neighbour's list is shrunk.
        for (int i = 1; i <= chosen; i++)
        {
            AddReverseLink(state, row[i], id, lc);
        }
    }

    private void AddReverseLink(GraphState state, int node, int newId, int lc)
    {
        MarkDirty(node);
        var row = state.Row(node, lc);
        int count = row[0];
        if (count < _parameters.MaxLinks(lc))
        {
            AppendLink(state, row, newId, lc);
            return;
        }

        var view = new ArrayGraphView(state);
        var nodeVector = view.Vector(node);
        int n = 0;
        foreach (int e in row.Slice(1, count))
        {
            _candidates[n++] = new Neighbour(e, CosineKernel.Distance(nodeVector, view.Vector(e)));
        }

        _candidates[n++] = new Neighbour(newId, CosineKernel.Distance(nodeVector, view.Vector(newId)));
        ShrinkRow(state, node, lc, _candidates.AsSpan(0, n));
    }

    /// <summary>Sorts <paramref name="candidates"/> by distance to <paramref name="node"/> and keeps the heuristic's choice as the node's links.</summary>
    private void ShrinkRow(GraphState state, int node, int lc, Span<Neighbour> candidates)
    {
        candidates.Sort(static (a, b) => a.Distance.CompareTo(b.Distance));
        int kept = SelectNeighboursHeuristic(state, candidates, _parameters.MaxLinks(lc), _selected);
        SetRow(state, node, lc, _selected.AsSpan(0, kept));
    }

    /// <summary>
    /// SELECT-NEIGHBORS-HEURISTIC (the paper's Algorithm 4, without extendCandidates): walk the candidates
    /// closest first and keep one only if it is closer to the base than to every neighbour already kept, which
    /// spreads links across directions; with keepPrunedConnections, top up to <paramref name="m"/> with the
    /// closest discarded ones.
    /// </summary>
    /// <param name="state">Storage holding the candidates' vectors.</param>
    /// <param name="candidates">Candidates with their distance to the base element, closest first.</param>
    /// <param name="m">How many to keep at most.</param>
    /// <param name="output">Receives the kept ids.</param>
    /// <returns>How many ids were written to <paramref name="output"/>.</returns>
    private int SelectNeighboursHeuristic(GraphState state, ReadOnlySpan<Neighbour> candidates, int m, Span<int> output)
    {
        var view = new ArrayGraphView(state);
        if (_discarded.Length < candidates.Length)
        {
            _discarded = new Neighbour[candidates.Length];
        }

        int kept = 0;
        int discarded = 0;
        foreach (var e in candidates)
        {
            if (kept >= m)
            {
                break;
            }

            var candidateVector = view.Vector(e.Id);
            bool closerToBase = true;
            for (int j = 0; j < kept; j++)
            {
                if (CosineKernel.Distance(candidateVector, view.Vector(output[j])) < e.Distance)
                {
                    closerToBase = false;
                    break;
                }
            }

            if (closerToBase)
            {
                output[kept++] = e.Id;
            }
            else
            {
                _discarded[discarded++] = e;
            }
        }

        if (_parameters.KeepPrunedConnections)
        {
            for (int i = 0; i < discarded && kept < m; i++)
            {
                output[kept++] = _discarded[i].Id;
            }
        }

        return kept;
    }

    private GraphState EnsureCapacity(int needed)
    {
        var state = _state;
        if (needed <= state.Capacity)
        {
            return state;
        }

        var grown = state.Grow((int)Math.Min(Math.Max(2L * state.Capacity, needed), Array.MaxLength), _count);
        Volatile.Write(ref _state, grown);
        return grown;
    }
}

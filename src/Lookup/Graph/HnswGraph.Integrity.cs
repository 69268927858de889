namespace Lookup.Graph;

/// <summary>Structural self-check of the graph.</summary>
public sealed partial class HnswGraph
{
    private const int ProblemsListed = 100;

    /// <summary>
    /// Checks every link list (no self-links, no duplicates, ids in range, counts within M / M_max0, targets that
    /// have the layer), the entry point (live, on the top layer of all live nodes) and that every live node is
    /// reachable on layer 0 from the entry point (walking through tombstones, as searches do).
    /// Must not overlap a write.
    /// </summary>
    public IntegrityReport CheckIntegrity()
    {
        var state = _state;
        var view = new ArrayGraphView(state);
        var problems = new List<string>();
        int problemCount = 0;
        void Report(string problem)
        {
            problemCount++;
            if (problems.Count < ProblemsListed)
            {
                problems.Add(problem);
            }
        }

        long links = 0;
        var seen = new HashSet<int>();
        for (int id = 0; id < _count; id++)
        {
            int level = state.Levels[id];
            for (int lc = 0; lc <= level; lc++)
            {
                var row = state.Row(id, lc);
                if (row.IsEmpty)
                {
                    Report($"node {id} has level {level} but no link list for layer {lc}");
                    continue;
                }

                int count = row[0];
                if (count < 0 || count > _parameters.MaxLinks(lc))
                {
                    Report($"node {id} layer {lc} has {count} links; allowed 0..{_parameters.MaxLinks(lc)}");
                    continue;
                }

                seen.Clear();
                foreach (int e in row.Slice(1, count))
                {
                    links++;
                    if (e == id)
                    {
                        Report($"node {id} layer {lc} links to itself");
                    }
                    else if ((uint)e >= (uint)_count)
                    {
                        Report($"node {id} layer {lc} links to {e}, outside 0..{_count - 1}");
                    }
                    else if (state.Levels[e] < lc)
                    {
                        Report($"node {id} layer {lc} links to {e}, which only reaches layer {state.Levels[e]}");
                    }

                    if (!seen.Add(e))
                    {
                        Report($"node {id} layer {lc} lists {e} twice");
                    }
                }
            }
        }

        int unreachable = CheckEntryAndReachability(state, view, Report);
        return new IntegrityReport(_count, (int)Math.Min(links, int.MaxValue), unreachable, problemCount, problems);
    }

    private int CheckEntryAndReachability(GraphState state, ArrayGraphView view, Action<string> report)
    {
        var entry = Entry;
        if (_live == 0)
        {
            return 0;
        }

        if (entry.IsNone || (uint)entry.Id >= (uint)_count || state.Deleted[entry.Id])
        {
            report($"entry point {entry.Id} is missing or deleted while {_live} nodes are live");
            return _live;
        }

        int topLive = 0;
        for (int id = 0; id < _count; id++)
        {
            if (!state.Deleted[id])
            {
                topLive = Math.Max(topLive, state.Levels[id]);
            }
        }

        if (entry.Level != state.Levels[entry.Id] || entry.Level < topLive)
        {
            report($"entry point {entry.Id} is recorded at layer {entry.Level}, has layer {state.Levels[entry.Id]}; the highest live layer is {topLive}");
        }

        var reached = new bool[_count];
        var queue = new Queue<int>();
        reached[entry.Id] = true;
        queue.Enqueue(entry.Id);
        while (queue.Count > 0)
        {
            foreach (int e in view.Links(queue.Dequeue(), 0))
            {
                if ((uint)e < (uint)_count && !reached[e])
                {
                    reached[e] = true;
                    queue.Enqueue(e);
                }
            }
        }

        int unreachable = 0;
        for (int id = 0; id < _count; id++)
        {
            if (!state.Deleted[id] && !reached[id])
            {
                if (unreachable++ < 5)
                {
                    report($"live node {id} cannot be reached from entry point {entry.Id} on layer 0");
                }
            }
        }

        return unreachable;
    }
}

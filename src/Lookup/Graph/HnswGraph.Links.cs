namespace Lookup.Graph;

/// <summary>
/// Every write of a link list goes through here, to publish it safely to concurrent readers and to keep the
/// layer-0 live in-degree that finds nodes a write would orphan. Writer only.
/// </summary>
public sealed partial class HnswGraph
{
    private readonly List<int> _orphans = [];

    /// <summary>Replaces the links of live <paramref name="node"/> on <paramref name="lc"/>: ids first, count last.</summary>
    private void SetRow(GraphState state, int node, int lc, ReadOnlySpan<int> ids)
    {
        var row = state.Row(node, lc);
        if (lc == 0)
        {
            foreach (int e in row.Slice(1, row[0]))
            {
                if (--state.InDegree0[e] == 0 && !state.Deleted[e])
                {
                    _orphans.Add(e);
                }
            }

            foreach (int e in ids)
            {
                state.InDegree0[e]++;
            }
        }

        ids.CopyTo(row[1..]);
        Volatile.Write(ref row[0], ids.Length);
    }

    /// <summary>Adds one link to a row that has room.</summary>
    private static void AppendLink(GraphState state, Span<int> row, int id, int lc)
    {
        int count = row[0];
        row[1 + count] = id;
        Volatile.Write(ref row[0], count + 1);
        if (lc == 0)
        {
            state.InDegree0[id]++;
        }
    }

    /// <summary>
    /// Gives every live node that lost its last live in-link on layer 0 a new one, so it stays reachable:
    /// from the closest of its own neighbours (then of a fresh search) that has room, or that can swap out its
    /// furthest link to a node other live nodes also reach.
    /// </summary>
    private void ReattachOrphans(GraphState state)
    {
        for (int i = 0; i < _orphans.Count; i++)
        {
            int orphan = _orphans[i];
            if (state.InDegree0[orphan] > 0 || state.Deleted[orphan] || orphan == Entry.Id)
            {
                continue;
            }

            if (!TryReattach(state, orphan, new ArrayGraphView(state).Links(orphan, 0).ToArray()))
            {
                var scratch = SearchScratch.ForCurrentThread();
                var view = new ArrayGraphView(state);
                var entry = Entry;
                var ep = new Neighbour(entry.Id, CosineKernel.Distance(view.Vector(orphan), view.Vector(entry.Id)));
                HnswAlgorithm.SearchLayer(view, view.Vector(orphan), [ep], _parameters.EfConstruction, 0, scratch);
                TryReattach(state, orphan, [.. scratch.TakeClosest(int.MaxValue).Select(n => n.Id)]);
            }
        }

        _orphans.Clear();
    }

    private bool TryReattach(GraphState state, int orphan, int[] hosts)
    {
        var view = new ArrayGraphView(state);
        var orphanVector = view.Vector(orphan);
        var distances = new float[hosts.Length];
        for (int i = 0; i < hosts.Length; i++)
        {
            distances[i] = CosineKernel.Distance(orphanVector, view.Vector(hosts[i]));
        }

        Array.Sort(distances, hosts);
        foreach (int host in hosts)
        {
            if (host == orphan || state.Deleted[host])
            {
                continue;
            }

            MarkDirty(host);
            var row = state.Row(host, 0);
            if (row[0] < _parameters.MaxM0)
            {
                AppendLink(state, row, orphan, 0);
                return true;
            }

            var links = row.Slice(1, row[0]).ToArray();
            if (links.Contains(orphan))
            {
                return true;
            }

            var hostVector = view.Vector(host);
            int furthest = -1;
            float furthestDistance = -1f;
            for (int j = 0; j < links.Length; j++)
            {
                float d = CosineKernel.Distance(hostVector, view.Vector(links[j]));
                if (state.InDegree0[links[j]] >= 2 && d > furthestDistance)
                {
                    furthest = j;
                    furthestDistance = d;
                }
            }

            if (furthest >= 0)
            {
                links[furthest] = orphan;
                SetRow(state, host, 0, links);
                return true;
            }
        }

        return false;
    }
}

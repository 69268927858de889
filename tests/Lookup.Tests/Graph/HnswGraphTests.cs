using Lookup.Graph;

namespace Lookup.Tests.Graph;

public sealed class HnswGraphTests
{
    private const int Dimension = 24;

    private static HnswGraph Build(int count, int seed, int m = 8)
    {
        var graph = new HnswGraph(Dimension, new HnswParameters(M: m, EfConstruction: 64, EfSearch: 32, Seed: seed, ExactBelow: 0));
        foreach (var v in SyntheticVectors.Clustered(count, Dimension, clusters: 10, spread: 0.4, seed))
        {
            graph.Add(v);
        }

        return graph;
    }

    [Fact]
    public void CheckIntegrity_passes_on_a_freshly_built_graph()
    {
        var report = Build(3000, seed: 1).CheckIntegrity();
        Assert.True(report.IsHealthy, report.ToString());
        Assert.Equal(3000, report.NodesChecked);
        Assert.True(report.LinksChecked > 3000 * 8);
    }

    [Fact]
    public void CheckIntegrity_passes_after_deleting_30_percent_including_the_entry_point()
    {
        var graph = Build(3000, seed: 2);
        int firstEntry = graph.Entry.Id;
        graph.Delete(firstEntry);
        var random = new Random(2);
        foreach (int id in Enumerable.Range(0, 3000).OrderBy(_ => random.Next()).Take(900))
        {
            graph.Delete(id);
        }

        var report = graph.CheckIntegrity();
        Assert.True(report.IsHealthy, report.ToString());
        Assert.NotEqual(firstEntry, graph.Entry.Id);
        Assert.False(graph.IsDeleted(graph.Entry.Id));
    }

    [Fact]
    public void CheckIntegrity_reports_a_self_link_a_duplicate_and_an_out_of_range_link()
    {
        var graph = Build(200, seed: 3);
        var row = graph.State.Row(5, 0);
        row[1] = 5;
        row[2] = row[3];
        var other = graph.State.Row(6, 0);
        other[1] = 10_000;

        var report = graph.CheckIntegrity();

        Assert.False(report.IsHealthy);
        Assert.Contains(report.Problems, p => p.Contains("node 5 layer 0 links to itself"));
        Assert.Contains(report.Problems, p => p.Contains("node 5 layer 0 lists") && p.Contains("twice"));
        Assert.Contains(report.Problems, p => p.Contains("node 6 layer 0 links to 10000, outside 0..199"));
    }

    [Fact]
    public void CheckIntegrity_reports_a_live_node_nobody_links_to()
    {
        var graph = Build(300, seed: 4);
        int orphan = Enumerable.Range(0, 300).First(id => id != graph.Entry.Id && graph.LevelOf(id) == 0);
        for (int id = 0; id < 300; id++)
        {
            var row = graph.State.Row(id, 0);
            var kept = row[1..(1 + row[0])].ToArray().Where(e => e != orphan).ToArray();
            kept.CopyTo(row[1..]);
            row[0] = kept.Length;
        }

        var report = graph.CheckIntegrity();
        Assert.Equal(1, report.UnreachableLiveNodes);
        Assert.Contains(report.Problems, p => p.Contains($"live node {orphan} cannot be reached"));
    }

    [Fact]
    public void Link_counts_respect_M_on_upper_layers_and_2M_on_layer_0()
    {
        var graph = Build(2000, seed: 5, m: 6);
        var view = new ArrayGraphView(graph.State);
        for (int id = 0; id < graph.Count; id++)
        {
            Assert.InRange(view.Links(id, 0).Length, 1, 12);
            for (int lc = 1; lc <= graph.LevelOf(id); lc++)
            {
                Assert.InRange(view.Links(id, lc).Length, 0, 6);
            }
        }
    }

    [Fact]
    public void DrawLevel_puts_about_one_node_in_M_above_layer_0()
    {
        // With mL = 1/ln M, P(level ≥ 1) = 1/M (the paper's level distribution): 1/8 of 4000 = 500, ±4σ ≈ 84.
        var graph = Build(4000, seed: 6, m: 8);
        int upper = Enumerable.Range(0, graph.Count).Count(id => graph.LevelOf(id) >= 1);
        Assert.InRange(upper, 500 - 84, 500 + 84);
        Assert.Equal(Enumerable.Range(0, graph.Count).Max(graph.LevelOf), graph.MaxLevel);
    }

    [Fact]
    public void Building_twice_with_the_same_seed_gives_the_same_graph()
    {
        var a = Build(500, seed: 7);
        var b = Build(500, seed: 7);
        Assert.Equal(a.Entry, b.Entry);
        Assert.Equal(a.State.Links0.AsSpan(0, 500 * a.State.Stride0).ToArray(), b.State.Links0.AsSpan(0, 500 * b.State.Stride0).ToArray());
    }

    [Fact]
    public void Search_below_ExactBelow_scans_and_equals_the_exact_oracle()
    {
        var vectors = SyntheticVectors.Clustered(300, Dimension, clusters: 3, spread: 1.0, seed: 8);
        var graph = new HnswGraph(Dimension, new HnswParameters(M: 4, EfConstruction: 8, EfSearch: 4, ExactBelow: 1000));
        var exact = new ExactSearch(Dimension);
        foreach (var v in vectors)
        {
            graph.Add(v);
            exact.Add(v);
        }

        foreach (var q in SyntheticVectors.Clustered(30, Dimension, clusters: 3, spread: 1.0, seed: 9))
        {
            Assert.Equal(exact.Search(q, 10), graph.Search(q, 10, ef: 1));
            Assert.Equal(exact.RangeSearch(q, 0.5f), graph.RangeSearch(q, 0.5f));
        }
    }

    [Fact]
    public async Task Searches_on_other_threads_during_inserts_and_deletes_return_only_valid_sorted_hits()
    {
        var vectors = SyntheticVectors.Clustered(6000, Dimension, clusters: 10, spread: 0.4, seed: 10);
        var graph = new HnswGraph(Dimension, new HnswParameters(M: 8, EfConstruction: 48, EfSearch: 32, ExactBelow: 0), initialCapacity: 16);
        for (int i = 0; i < 100; i++)
        {
            graph.Add(vectors[i]);
        }

        using var stop = new CancellationTokenSource();
        var failures = new System.Collections.Concurrent.ConcurrentQueue<string>();
        var readers = Enumerable.Range(0, 2).Select(r => Task.Run(() =>
        {
            var random = new Random(r);
            while (!stop.IsCancellationRequested)
            {
                Neighbour[] hits;
                try
                {
                    hits = graph.Search(vectors[random.Next(vectors.Length)], 10);
                }
                catch (Exception error) when (error is IndexOutOfRangeException or ArgumentException or InvalidOperationException)
                {
                    failures.Enqueue(error.ToString());
                    return;
                }

                int count = graph.Count;
                for (int i = 0; i < hits.Length; i++)
                {
                    if ((uint)hits[i].Id >= (uint)vectors.Length || (i > 0 && hits[i].Distance < hits[i - 1].Distance))
                    {
                        failures.Enqueue($"bad hit {hits[i]} at count {count}");
                    }
                }
            }
        })).ToArray();

        for (int i = 100; i < vectors.Length; i++)
        {
            graph.Add(vectors[i]);
            if (i % 10 == 0)
            {
                graph.Delete(i - 50);
            }
        }

        stop.Cancel();
        await Task.WhenAll(readers);
        Assert.Empty(failures);
        var report = graph.CheckIntegrity();
        Assert.True(report.IsHealthy, report.ToString());
    }
}

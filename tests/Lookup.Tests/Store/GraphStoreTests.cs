using Lookup.Graph;
using Lookup.Store;
using Lookup.Tests.Graph;

namespace Lookup.Tests.Store;

public sealed class GraphStoreTests
{
    private const int Dimension = 32;
    private static readonly HnswParameters Parameters = new(M: 12, EfConstruction: 100, EfSearch: 64, ExactBelow: 0);

    private static float[][] Vectors(int count, int seed) => SyntheticVectors.Clustered(count, Dimension, clusters: 12, spread: 0.35, seed);

    [Fact]
    public void Commit_after_one_insert_writes_only_the_new_node_and_the_neighbours_it_touched()
    {
        using var temp = new TempIndex();
        using var file = IndexFile.Open(temp.Path, IndexAccess.Write);
        var store = new GraphStore(file);
        var graph = store.Create(Dimension, Parameters, "m");
        foreach (var v in Vectors(2000, 1))
        {
            graph.Add(v);
        }

        Assert.Equal(2000, store.Commit(graph));
        graph.Add(Vectors(1, 2)[0]);
        int written = store.Commit(graph);

        // The new node plus at most M neighbours per layer it joined (a reverse link each).
        Assert.InRange(written, 2, 1 + (Parameters.M * (graph.LevelOf(2000) + 1)));
    }

    [Fact]
    public void OpenLazy_reads_only_the_metadata_and_the_nodes_a_search_visits()
    {
        using var temp = new TempIndex();
        WriteGraph(temp.Path, Vectors(5000, 3));
        using var file = IndexFile.Open(temp.Path, IndexAccess.Read);
        var lazy = new GraphStore(file).OpenLazy();
        Assert.Equal(0, lazy.VectorsLoaded);

        var hits = lazy.Search(Vectors(1, 4)[0], 10);

        Assert.Equal(10, hits.Length);
        Assert.InRange(lazy.VectorsLoaded, 10, 5000 / 2);
    }

    [Fact]
    public void Changes_not_committed_are_absent_after_reopening_and_the_graph_stays_intact()
    {
        using var temp = new TempIndex();
        var vectors = Vectors(1500, 5);
        using (var file = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            var store = new GraphStore(file);
            var graph = store.Create(Dimension, Parameters, "m");
            foreach (var v in vectors.Take(1000))
            {
                graph.Add(v);
            }

            store.Commit(graph);
            foreach (var v in vectors.Skip(1000))
            {
                graph.Add(v);
            }

            graph.Delete(3);
        }

        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);
        var loaded = new GraphStore(reader).Load();
        Assert.Equal(1000, loaded.Count);
        Assert.False(loaded.IsDeleted(3));
        var report = loaded.CheckIntegrity();
        Assert.True(report.IsHealthy, report.ToString());
    }

    [Fact]
    public void A_caller_transaction_that_rolls_back_takes_the_graph_batch_with_it()
    {
        using var temp = new TempIndex();
        var vectors = Vectors(800, 6);
        using (var file = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            var store = new GraphStore(file);
            var graph = store.Create(Dimension, Parameters, "m");
            foreach (var v in vectors.Take(400))
            {
                graph.Add(v);
            }

            store.Commit(graph);
            foreach (var v in vectors.Skip(400))
            {
                graph.Add(v);
            }

            Assert.Throws<InvalidOperationException>(() => file.InTransaction(() =>
            {
                store.Commit(graph);
                throw new InvalidOperationException("photo record failed");
            }));
        }

        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);
        var loaded = new GraphStore(reader).Load();
        Assert.Equal(400, loaded.Count);
        Assert.True(loaded.CheckIntegrity().IsHealthy);
    }

    [Fact]
    public void A_reopened_writer_keeps_inserting_and_the_result_stays_healthy_and_accurate()
    {
        using var temp = new TempIndex();
        var vectors = Vectors(3000, 7);
        WriteGraph(temp.Path, vectors.Take(1500).ToArray());
        using (var file = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            var store = new GraphStore(file);
            var graph = store.Load("m");
            foreach (var v in vectors.Skip(1500))
            {
                graph.Add(v);
            }

            store.Commit(graph);
        }

        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);
        var loaded = new GraphStore(reader).Load();
        Assert.True(loaded.CheckIntegrity().IsHealthy);
        var exact = new ExactSearch(Dimension);
        foreach (var v in vectors)
        {
            exact.Add(v);
        }

        // Against the same vectors built in one go in memory: reopening in the middle must not cost recall.
        var oneGo = new HnswGraph(Dimension, Parameters);
        foreach (var v in vectors)
        {
            oneGo.Add(v);
        }

        var queries = Vectors(200, 8).ToList();
        double reopened = Recall.AtK(loaded, exact, queries, 10);
        double reference = Recall.AtK(oneGo, exact, queries, 10);
        Assert.True(reopened >= reference - 0.02, $"recall@10 {reopened:F3} after reopening vs {reference:F3} built in one go");
    }

    [Fact]
    public void A_graph_built_with_another_model_is_refused_naming_both()
    {
        using var temp = new TempIndex();
        WriteGraph(temp.Path, Vectors(50, 9));
        using var file = IndexFile.Open(temp.Path, IndexAccess.Read);
        var error = Assert.Throws<IndexFileException>(() => new GraphStore(file).OpenLazy("resnet50:abc"));
        Assert.Equal(IndexFileProblem.ModelMismatch, error.Problem);
        Assert.Contains("built with model m", error.Message);
        Assert.Contains("resnet50:abc", error.Message);
    }

    [Fact]
    public void Opening_a_graph_in_a_file_without_one_says_to_ingest_first()
    {
        using var temp = new TempIndex();
        IndexFile.Open(temp.Path, IndexAccess.Write).Dispose();
        using var file = IndexFile.Open(temp.Path, IndexAccess.Read);
        var error = Assert.Throws<IndexFileException>(() => new GraphStore(file).OpenLazy());
        Assert.Equal(IndexFileProblem.NoGraph, error.Problem);
    }

    [Fact]
    public void A_lazy_reader_keeps_its_snapshot_while_the_writer_commits_more()
    {
        using var temp = new TempIndex();
        var vectors = Vectors(2000, 10);
        using var writerFile = IndexFile.Open(temp.Path, IndexAccess.Write);
        var store = new GraphStore(writerFile);
        var graph = store.Create(Dimension, Parameters, "m");
        foreach (var v in vectors.Take(1000))
        {
            graph.Add(v);
        }

        store.Commit(graph);
        using var readerFile = IndexFile.Open(temp.Path, IndexAccess.Read);
        var lazy = new GraphStore(readerFile).OpenLazy();
        var before = Vectors(20, 11).Select(q => lazy.Search(q, 10)).ToList();
        for (int i = 1000; i < 2000; i++)
        {
            graph.Add(vectors[i]);
            if (i % 100 == 0)
            {
                store.Commit(graph);
            }
        }

        store.Commit(graph);
        Assert.Equal(1000, lazy.Count);
        var after = Vectors(20, 11).Select(q => lazy.Search(q, 10)).ToList();
        Assert.Equal(before, after);
        Assert.All(after.SelectMany(h => h), h => Assert.InRange(h.Id, 0, 999));
    }

    private static void WriteGraph(string path, float[][] vectors)
    {
        using var file = IndexFile.Open(path, IndexAccess.Write);
        var store = new GraphStore(file);
        var graph = store.Create(Dimension, Parameters, "m");
        foreach (var v in vectors)
        {
            graph.Add(v);
        }

        store.Commit(graph);
    }
}

using Lookup.Graph;
using Lookup.Store;
using Lookup.Tests.Graph;

namespace Lookup.Tests.Store;

/// <summary>
/// One contract for every way of holding a graph: a graph built and changed in memory (with incremental commits
/// to an index file along the way) must answer every query exactly as the implementation under test does —
/// the in-memory graph itself, the graph loaded whole from the file, and the lazily read file.
/// </summary>
public abstract class GraphSearchContract : IDisposable
{
    private const int Dimension = 32;
    private readonly TempIndex _temp = new();
    private readonly List<IDisposable> _open = [];

    public void Dispose()
    {
        foreach (var d in _open)
        {
            d.Dispose();
        }

        _temp.Dispose();
    }

    /// <summary>The implementation under test, holding the graph <paramref name="written"/> committed to <paramref name="path"/> (the writer is closed by then).</summary>
    private protected abstract INearestSearch Under(HnswGraph written, string path, List<IDisposable> keepOpen);

    private (HnswGraph Graph, INearestSearch Under, float[][] Queries) Arrange(int exactBelow = 0)
    {
        var vectors = SyntheticVectors.Clustered(3000, Dimension, clusters: 15, spread: 0.35, seed: 31);
        HnswGraph graph;
        using (var file = IndexFile.Open(_temp.Path, IndexAccess.Write))
        {
            var store = new GraphStore(file);
            graph = store.Create(Dimension, new HnswParameters(M: 10, EfConstruction: 80, EfSearch: 40, ExactBelow: exactBelow), "test-model");
            for (int i = 0; i < 1500; i++)
            {
                graph.Add(vectors[i]);
            }

            store.Commit(graph);
            for (int i = 1500; i < 3000; i++)
            {
                graph.Add(vectors[i]);
                if (i % 7 == 0)
                {
                    graph.Delete(i - 1000);
                }
            }

            graph.Delete(graph.Entry.Id);
            store.Commit(graph);
        }

        var queries = SyntheticVectors.Clustered(100, Dimension, clusters: 15, spread: 0.35, seed: 32);
        return (graph, Under(graph, _temp.Path, _open), queries);
    }

    [Fact]
    public void Counts_tombstones_and_vectors_match_the_written_graph()
    {
        var (graph, under, _) = Arrange();
        Assert.Equal(graph.Count, under.Count);
        Assert.Equal(graph.LiveCount, under.LiveCount);
        for (int id = 0; id < graph.Count; id += 13)
        {
            Assert.Equal(graph.IsDeleted(id), under.IsDeleted(id));
            Assert.Equal(graph.GetVector(id).ToArray(), under.GetVector(id).ToArray());
        }
    }

    [Theory]
    [InlineData(10, 16)]
    [InlineData(10, 64)]
    [InlineData(1, 40)]
    public void Search_answers_every_query_identically(int k, int ef)
    {
        var (graph, under, queries) = Arrange();
        foreach (var q in queries)
        {
            Assert.Equal(graph.Search(q, k, ef), under.Search(q, k, ef));
        }
    }

    [Fact]
    public void RangeSearch_answers_every_query_identically()
    {
        var (graph, under, queries) = Arrange();
        foreach (var q in queries)
        {
            Assert.Equal(graph.RangeSearch(q, 0.2f), under.RangeSearch(q, 0.2f));
        }
    }

    [Fact]
    public void Small_graphs_answer_identically_through_the_exact_scan()
    {
        var (graph, under, queries) = Arrange(exactBelow: 5000);
        foreach (var q in queries.Take(20))
        {
            Assert.Equal(graph.Search(q, 10), under.Search(q, 10));
            Assert.Equal(graph.RangeSearch(q, 0.2f), under.RangeSearch(q, 0.2f));
        }
    }
}

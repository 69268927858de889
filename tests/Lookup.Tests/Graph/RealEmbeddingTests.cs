using Lookup.Graph;
using Lookup.Tests.Datasets;
using Xunit.Abstractions;

namespace Lookup.Tests.Graph;

/// <summary>
/// The graph on real ResNet18 embeddings of Fashion-MNIST (Xiao, Rasul &amp; Vollgraf 2017; Debian
/// dataset-fashion-mnist), checked against brute force: the first 1,500 images are the index, the last 500 the queries.
/// </summary>
public sealed class RealEmbeddingTests(FashionMnistEmbeddings data, ITestOutputHelper output) : IClassFixture<FashionMnistEmbeddings>
{
    private const int IndexSize = 1500;

    [Fact]
    public void Committed_embeddings_match_a_fresh_embedding_of_a_sample_of_the_images()
    {
        using var embedder = new FashionMnistEmbedder();
        foreach (int i in new[] { 0, 777, 1999 })
        {
            var fresh = embedder.Embed(data.Images[i]);
            // float16 storage keeps about 3 significant digits per component.
            Assert.True(SyntheticVectors.ReferenceDistance(fresh, data.Vectors[i]) < 1e-4, $"image {i} embeds differently from the committed file: regenerate it (tests/reference-data/SOURCES.md)");
        }
    }

    [Fact]
    public void Search_recall_at_10_is_at_least_095_against_brute_force()
    {
        var (graph, exact) = Build(new HnswParameters(ExactBelow: 0));
        var queries = data.Vectors.Skip(IndexSize).ToList();
        double recall = Recall.AtK(graph, exact, queries, 10);
        output.WriteLine($"recall@10 at EfSearch 64: {recall:F4}");
        Assert.InRange(recall, 0.95, 1.0);
    }

    [Fact]
    public void Search_recall_at_10_stays_at_least_095_after_deleting_30_percent()
    {
        var (graph, exact) = Build(new HnswParameters(ExactBelow: 0));
        var random = new Random(21);
        foreach (int id in Enumerable.Range(0, IndexSize).OrderBy(_ => random.Next()).Take(IndexSize * 3 / 10))
        {
            graph.Delete(id);
            exact.Delete(id);
        }

        Assert.True(graph.CheckIntegrity().IsHealthy);
        Assert.InRange(Recall.AtK(graph, exact, data.Vectors.Skip(IndexSize).ToList(), 10), 0.95, 1.0);
    }

    [Fact]
    public void Knn_classifier_over_the_graph_is_within_one_point_of_exact_knn_accuracy()
    {
        var (graph, exact) = Build(new HnswParameters(ExactBelow: 0));
        double graphAccuracy = Accuracy(graph);
        double exactAccuracy = Accuracy(exact);
        output.WriteLine($"5-NN accuracy: graph {graphAccuracy:F4}, exact {exactAccuracy:F4}");

        // The embeddings must carry class information at all (10 classes: chance is 0.10).
        Assert.True(exactAccuracy > 0.6, $"exact 5-NN accuracy {exactAccuracy:F3}");
        Assert.True(graphAccuracy >= exactAccuracy - 0.01, $"graph {graphAccuracy:F3} vs exact {exactAccuracy:F3}");
    }

    private (HnswGraph Graph, ExactSearch Exact) Build(HnswParameters parameters)
    {
        var graph = new HnswGraph(FashionMnistEmbedder.Dimension, parameters);
        var exact = new ExactSearch(FashionMnistEmbedder.Dimension);
        foreach (var v in data.Vectors.Take(IndexSize))
        {
            graph.Add(v);
            exact.Add(v);
        }

        return (graph, exact);
    }

    /// <summary>5-NN majority vote (ties to the class of the nearer neighbours) over the 500 held-out images.</summary>
    private double Accuracy(INearestSearch index)
    {
        int correct = 0;
        for (int q = IndexSize; q < data.Vectors.Length; q++)
        {
            var votes = index.Search(data.Vectors[q], 5)
                .Select((hit, rank) => (Label: data.Labels[hit.Id], rank))
                .GroupBy(v => v.Label)
                .OrderByDescending(g => g.Count())
                .ThenBy(g => g.Min(v => v.rank))
                .First().Key;
            correct += votes == data.Labels[q] ? 1 : 0;
        }

        return (double)correct / (data.Vectors.Length - IndexSize);
    }
}

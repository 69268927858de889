using Lookup.Graph;
using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// The sweep's neighbour search over the HNSW graph (<see cref="GraphNeighbourSource"/>) against the exact oracle
/// (<see cref="ExactNeighbourSource"/>) on clustered synthetic vectors: groups of near copies, as a catalogue has.
/// </summary>
public sealed class GraphNeighbourSourceTests
{
    private const float Radius = 0.25f;

    [Fact]
    public void FindWithin_agrees_with_the_exact_scan_on_distances_and_finds_nearly_every_neighbour()
    {
        var (photos, graph) = Clustered(count: 2000, seed: 7);
        var exact = new ExactNeighbourSource(photos);
        var source = new GraphNeighbourSource(graph);
        var (found, wanted) = (0, 0);

        foreach (var photo in photos)
        {
            var truth = Query(exact, photo.Id).ToDictionary(h => h.PhotoId, h => h.Distance);
            var hits = Query(source, photo.Id);
            Assert.All(hits, h => Assert.InRange(h.Distance, 0f, Radius));
            Assert.All(hits, h => Assert.Equal(truth[h.PhotoId], h.Distance, 1e-4f));
            found += hits.Count(h => truth.ContainsKey(h.PhotoId));
            wanted += truth.Count;
        }

        // Floor stated for this test: the graph's range search is approximate (DEVELOPERS.md § Graph), 0.98 leaves room.
        Assert.True(found >= 0.98 * wanted, $"recall {found}/{wanted}");
    }

    [Fact]
    public void FindWithin_gives_the_same_answers_from_many_threads_at_once()
    {
        var (photos, graph) = Clustered(count: 1000, seed: 8);
        var source = new GraphNeighbourSource(graph);
        var sequential = photos.Select(p => Sorted(Query(source, p.Id))).ToList();

        var parallel = new string[photos.Count];
        Parallel.For(0, photos.Count, new ParallelOptions { MaxDegreeOfParallelism = 4 }, i => parallel[i] = Sorted(Query(source, photos[i].Id)));

        Assert.Equal(sequential, parallel);
    }

    private static string Sorted(List<SweepNeighbour> hits) =>
        string.Join(' ', hits.OrderBy(h => h.PhotoId).Select(h => $"{h.PhotoId}:{h.Distance:0.00000}"));

    private static List<SweepNeighbour> Query(INeighbourSource source, int id)
    {
        var results = new List<SweepNeighbour>();
        source.FindWithin(id, Radius, results);
        return results;
    }

    /// <summary>Clusters of 1–6 vectors within 0.02–0.3 of a random centre; photo id = node id.</summary>
    private static (List<SweepPhoto> Photos, HnswGraph Graph) Clustered(int count, int seed)
    {
        var random = new Random(seed);
        var graph = new HnswGraph(SweepFixtures.Dimension, SyntheticIndex.WalkAlways);
        var photos = new List<SweepPhoto>();
        while (photos.Count < count)
        {
            var centre = SweepFixtures.RandomUnit(random);
            for (var k = random.Next(1, 7); k > 0 && photos.Count < count; k--)
            {
                var v = SweepFixtures.Near(centre, 0.02 + (0.28 * random.NextDouble()), random);
                var id = graph.Add(v);
                photos.Add(new SweepPhoto(id, "S", $"p{id}", $"{id:x64}", 0, 1, 1, 1, v));
            }
        }

        return (photos, graph);
    }
}

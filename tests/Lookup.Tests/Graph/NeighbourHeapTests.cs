using Lookup.Graph;

namespace Lookup.Tests.Graph;

public sealed class NeighbourHeapTests
{
    [Fact]
    public void Pop_returns_closest_first_for_the_candidate_order_and_furthest_first_for_the_result_order()
    {
        var random = new Random(3);
        var distances = Enumerable.Range(0, 500).Select(_ => (float)random.NextDouble()).ToArray();
        var closest = new NeighbourHeap<ClosestFirst>();
        var furthest = new NeighbourHeap<FurthestFirst>();
        for (int i = 0; i < distances.Length; i++)
        {
            closest.Push(new Neighbour(i, distances[i]));
            furthest.Push(new Neighbour(i, distances[i]));
        }

        var ascending = distances.Order().ToArray();
        Assert.Equal(ascending, Enumerable.Range(0, 500).Select(_ => closest.Pop().Distance));
        Assert.Equal(ascending.Reverse(), Enumerable.Range(0, 500).Select(_ => furthest.Pop().Distance));
        Assert.Equal(0, closest.Count);
    }
}

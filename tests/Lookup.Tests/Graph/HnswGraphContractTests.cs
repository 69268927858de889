using Lookup.Graph;

namespace Lookup.Tests.Graph;

public sealed class HnswGraphContractTests : NearestIndexContract
{
    // ExactBelow = 0 so the graph walk, not the small-index scan, answers; a small capacity exercises growth.
    private protected override INearestIndex Create(int dimension) =>
        new HnswGraph(dimension, new HnswParameters(M: 12, EfConstruction: 100, EfSearch: 48, ExactBelow: 0), initialCapacity: 16);
}

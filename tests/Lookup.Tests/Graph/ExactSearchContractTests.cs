using Lookup.Graph;

namespace Lookup.Tests.Graph;

public sealed class ExactSearchContractTests : NearestIndexContract
{
    private protected override INearestIndex Create(int dimension) => new ExactSearch(dimension, initialCapacity: 4);
}

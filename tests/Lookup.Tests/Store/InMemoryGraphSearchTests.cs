using Lookup.Graph;

namespace Lookup.Tests.Store;

public sealed class InMemoryGraphSearchTests : GraphSearchContract
{
    private protected override INearestSearch Under(HnswGraph written, string path, List<IDisposable> keepOpen) => written;
}

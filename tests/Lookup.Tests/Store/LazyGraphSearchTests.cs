using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Tests.Store;

public sealed class LazyGraphSearchTests : GraphSearchContract
{
    private protected override INearestSearch Under(HnswGraph written, string path, List<IDisposable> keepOpen)
    {
        var file = IndexFile.Open(path, IndexAccess.Read);
        keepOpen.Add(file);
        return new GraphStore(file).OpenLazy("test-model");
    }
}

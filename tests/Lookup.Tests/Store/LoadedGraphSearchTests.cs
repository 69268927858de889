using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Tests.Store;

public sealed class LoadedGraphSearchTests : GraphSearchContract
{
    private protected override INearestSearch Under(HnswGraph written, string path, List<IDisposable> keepOpen)
    {
        var file = IndexFile.Open(path, IndexAccess.Read);
        keepOpen.Add(file);
        var loaded = new GraphStore(file).Load("test-model");
        Assert.True(loaded.CheckIntegrity().IsHealthy);
        return loaded;
    }
}

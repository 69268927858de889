using System.Reflection;
using System.Runtime.InteropServices;
using Cloud.Unum.USearch;

namespace Lookup.Bench;

/// <summary>
/// The native HNSW peer (USearch) configured like our graph: cosine, f32, connectivity M, expansion_add =
/// EfConstruction. Its C# binding cannot change expansion_search after construction, so that one call goes
/// straight to the C library the package ships.
/// </summary>
internal sealed partial class PeerIndex : IDisposable
{
    private readonly USearchIndex _index;
    private readonly nint _handle;

    public PeerIndex(int dimension, int m, int efConstruction, int efSearch)
    {
        _index = new USearchIndex(MetricKind.Cos, ScalarKind.Float32, (ulong)dimension, (ulong)m, (ulong)efConstruction, (ulong)efSearch, false);
        _handle = (nint)typeof(USearchIndex).GetField("_index", BindingFlags.NonPublic | BindingFlags.Instance)!.GetValue(_index)!;
    }

    public static string Acceleration => USearchCapabilities.HardwareAccelerationAvailable();

    public void Add(int key, float[] vector) => _index.Add((ulong)key, vector);

    public void SetEfSearch(int ef)
    {
        nint error = 0;
        ChangeExpansionSearch(_handle, (nuint)ef, ref error);
        if (error != 0)
        {
            throw new InvalidOperationException("usearch_change_expansion_search failed: " + Marshal.PtrToStringUTF8(error));
        }
    }

    public int Search(float[] query, int k, out ulong[] keys, out float[] distances) => _index.Search(query, k, out keys, out distances);

    public void Dispose() => _index.Dispose();

    [LibraryImport("libusearch_c", EntryPoint = "usearch_change_expansion_search")]
    private static partial void ChangeExpansionSearch(nint index, nuint expansion, ref nint error);
}

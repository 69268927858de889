using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Matching;

/// <summary>
/// What ranking needs from an index: nearest photos of a vector, the photo behind a graph node, a SKU's photos and
/// their stored vectors, and photos by content hash. Implementations are safe for concurrent readers.
/// </summary>
internal interface IMatchCatalogue
{
    /// <summary>The <paramref name="k"/> nearest live photo nodes to <paramref name="vector"/>, closest first.</summary>
    Neighbour[] Nearest(ReadOnlySpan<float> vector, int k);

    /// <summary>The indexed photo stored at graph node <paramref name="node"/>, or null.</summary>
    PhotoRecord? PhotoAt(int node);

    /// <summary>The indexed photos of <paramref name="sku"/> (each with a live node).</summary>
    IReadOnlyList<PhotoRecord> PhotosOf(string sku);

    /// <summary>Indexed photos whose bytes hash to <paramref name="sha256"/>.</summary>
    IReadOnlyList<PhotoRecord> PhotosWithContent(string sha256);

    /// <summary>The stored unit vector of node <paramref name="node"/>.</summary>
    ReadOnlySpan<float> Vector(int node);
}

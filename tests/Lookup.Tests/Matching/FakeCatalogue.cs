using Lookup.Graph;
using Lookup.Matching;
using Lookup.Store;

namespace Lookup.Tests.Matching;

/// <summary>An in-memory <see cref="IMatchCatalogue"/>: photos with SKUs and unit vectors, searched exactly.</summary>
internal sealed class FakeCatalogue : IMatchCatalogue
{
    private readonly List<(PhotoRecord Photo, float[] Vector)> _photos = [];

    public int Searches { get; private set; }

    /// <summary>Adds a photo whose vector is <paramref name="vector"/> normalised; returns its node.</summary>
    public int Add(string sku, string path, float[] vector, string? sha256 = null, ulong dHash = 0)
    {
        int node = _photos.Count;
        var unit = new float[vector.Length];
        CosineKernel.Normalize(vector, unit);
        _photos.Add((new PhotoRecord { Path = path, Sku = sku, Sha256 = sha256 ?? $"sha-{node}", Status = PhotoStatus.Indexed, NodeId = node, DHash = dHash }, unit));
        return node;
    }

    public Neighbour[] Nearest(ReadOnlySpan<float> vector, int k)
    {
        Searches++;
        var query = vector.ToArray();
        return [.. _photos.Select((p, i) => new Neighbour(i, CosineKernel.Distance(query, p.Vector))).OrderBy(n => n.Distance).Take(k)];
    }

    public PhotoRecord? PhotoAt(int node) => node < _photos.Count ? _photos[node].Photo : null;

    public IReadOnlyList<PhotoRecord> PhotosOf(string sku) => [.. _photos.Where(p => p.Photo.Sku == sku).Select(p => p.Photo)];

    public IReadOnlyList<PhotoRecord> PhotosWithContent(string sha256) => [.. _photos.Where(p => p.Photo.Sha256 == sha256).Select(p => p.Photo)];

    public ReadOnlySpan<float> Vector(int node) => _photos[node].Vector;
}

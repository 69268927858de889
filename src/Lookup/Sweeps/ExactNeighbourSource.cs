using System.Numerics.Tensors;

namespace Lookup.Sweeps;

/// <summary>
/// The exact answer by scanning every photo: O(n) per query, so O(n²) for a sweep. It is the oracle for tests and
/// serves small catalogues; large ones use the graph. Immutable after construction, so safe for concurrent reads.
/// </summary>
public sealed class ExactNeighbourSource : INeighbourSource
{
    private readonly int[] _ids;
    private readonly float[] _vectors;
    private readonly int _dimension;
    private readonly Dictionary<int, int> _indexOfId;

    /// <summary>Copies the embeddings of <paramref name="photos"/> into one contiguous array.</summary>
    public ExactNeighbourSource(IReadOnlyList<SweepPhoto> photos)
    {
        ArgumentNullException.ThrowIfNull(photos);
        _dimension = photos.Count == 0 ? 0 : photos[0].Embedding.Length;
        _ids = new int[photos.Count];
        _vectors = new float[photos.Count * _dimension];
        _indexOfId = new Dictionary<int, int>(photos.Count);
        for (var i = 0; i < photos.Count; i++)
        {
            var photo = photos[i];
            if (photo.Embedding.Length != _dimension)
            {
                throw new ArgumentException(
                    $"Photo {photo.Path} has an embedding of {photo.Embedding.Length} floats, the first photo has " +
                    $"{_dimension}: every photo of one sweep must come from the same model.", nameof(photos));
            }

            _ids[i] = photo.Id;
            _indexOfId.Add(photo.Id, i);
            photo.Embedding.Span.CopyTo(_vectors.AsSpan(i * _dimension, _dimension));
        }
    }

    /// <inheritdoc />
    public void FindWithin(int photoId, float radius, List<SweepNeighbour> results)
    {
        ArgumentNullException.ThrowIfNull(results);
        var query = Vector(_indexOfId[photoId]);
        for (var i = 0; i < _ids.Length; i++)
        {
            var distance = 1f - TensorPrimitives.Dot(query, Vector(i));
            if (distance <= radius)
            {
                results.Add(new SweepNeighbour(_ids[i], distance));
            }
        }
    }

    private ReadOnlySpan<float> Vector(int index) => _vectors.AsSpan(index * _dimension, _dimension);
}

namespace Lookup.Graph;

/// <summary>
/// The exact oracle: stores unit vectors contiguously and answers every query by scanning them all.
/// Same interface and same distances as <see cref="HnswGraph"/>, so tests and the bench compare like with like.
/// Thread safety: one writer (<see cref="Add"/>, <see cref="Delete"/>) at a time, never concurrently with
/// readers; any number of concurrent readers while no write is running.
/// </summary>
public sealed class ExactSearch : INearestIndex
{
    private float[] _vectors;
    private bool[] _deleted;
    private int _count;
    private int _live;

    /// <summary>An empty oracle for vectors of <paramref name="dimension"/> floats.</summary>
    public ExactSearch(int dimension, int initialCapacity = 1024)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(dimension);
        Dimension = dimension;
        _vectors = new float[(long)Math.Max(initialCapacity, 1) * dimension];
        _deleted = new bool[Math.Max(initialCapacity, 1)];
    }

    /// <inheritdoc />
    public int Dimension { get; }

    /// <inheritdoc />
    public int Count => _count;

    /// <inheritdoc />
    public int LiveCount => _live;

    /// <inheritdoc />
    public int Add(ReadOnlySpan<float> vector)
    {
        GraphGuard.Dimension(vector.Length, Dimension);
        if (_count == _deleted.Length)
        {
            Array.Resize(ref _vectors, _vectors.Length * 2);
            Array.Resize(ref _deleted, _deleted.Length * 2);
        }

        CosineKernel.Normalize(vector, _vectors.AsSpan(_count * Dimension, Dimension));
        _live++;
        return _count++;
    }

    /// <inheritdoc />
    public void Delete(int id)
    {
        GraphGuard.Id(id, _count);
        if (!_deleted[id])
        {
            _deleted[id] = true;
            _live--;
        }
    }

    /// <inheritdoc />
    public bool IsDeleted(int id)
    {
        GraphGuard.Id(id, _count);
        return _deleted[id];
    }

    /// <inheritdoc />
    public ReadOnlySpan<float> GetVector(int id)
    {
        GraphGuard.Id(id, _count);
        return _vectors.AsSpan(id * Dimension, Dimension);
    }

    /// <inheritdoc />
    public Neighbour[] Search(ReadOnlySpan<float> query, int k, int? ef = null)
    {
        GraphGuard.Query(query.Length, Dimension, k);
        var scratch = SearchScratch.ForCurrentThread();
        var unit = scratch.NormalisedQuery(query);
        return ExactScan.TopK(_vectors, _deleted, Dimension, _count, unit, k, scratch);
    }

    /// <inheritdoc />
    public Neighbour[] RangeSearch(ReadOnlySpan<float> query, float radius)
    {
        GraphGuard.Query(query.Length, Dimension, 1);
        var unit = SearchScratch.ForCurrentThread().NormalisedQuery(query);
        return ExactScan.Within(_vectors, _deleted, Dimension, _count, unit, radius);
    }
}

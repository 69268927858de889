namespace Lookup.Graph;

/// <summary>
/// Hierarchical Navigable Small World graph (Malkov &amp; Yashunin, 2018) over unit vectors with cosine distance.
/// Vectors live in one contiguous array (stride = dimension), layer-0 links in a fixed-stride int array
/// (count, then ids), upper layers in small per-node arrays.
/// <para>
/// Thread safety: one writer, many readers, no locks. <see cref="Add"/> and <see cref="Delete"/> must be called
/// by one thread at a time (the caller serialises writes). <see cref="Search"/>, <see cref="RangeSearch"/>,
/// <see cref="GetVector"/>, <see cref="IsDeleted"/> and the counts may run on any number of threads, also while
/// the writer works: the writer stores link ids before their count, publishes a grown array set before the new
/// count, and the count before the entry point, so a reader sees every link list whole or as a mix of valid ids,
/// and may simply miss the node being inserted. <see cref="CheckIntegrity"/> must not overlap a write.
/// </para>
/// </summary>
public sealed partial class HnswGraph : INearestIndex
{
    private const int LevelCap = 30;

    private readonly HnswParameters _parameters;
    private readonly Random _random;
    private readonly int[] _selected;
    private readonly Neighbour[] _candidates;
    private Neighbour[] _discarded;
    private GraphState _state;
    private long _entry = -1;
    private int _count;
    private int _live;
    private HashSet<int>? _dirty;

    /// <summary>An empty graph for vectors of <paramref name="dimension"/> floats.</summary>
    public HnswGraph(int dimension, HnswParameters? parameters = null, int initialCapacity = 1024)
        : this(dimension, parameters ?? new HnswParameters(), initialCapacity, seedOffset: 0)
    {
    }

    private HnswGraph(int dimension, HnswParameters parameters, int initialCapacity, int seedOffset)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(dimension);
        ArgumentNullException.ThrowIfNull(parameters);
        parameters.Validate();
        Dimension = dimension;
        _parameters = parameters;
        _random = new Random(unchecked((parameters.Seed * 1_000_003) + seedOffset));
        _state = new GraphState(dimension, parameters.M, Math.Max(initialCapacity, 16));
        _selected = new int[parameters.MaxM0 + 1];
        _candidates = new Neighbour[(2 * parameters.MaxM0) + 2];
        _discarded = new Neighbour[Math.Max(parameters.EfConstruction, 2 * parameters.MaxM0) + 2];
    }

    /// <inheritdoc />
    public int Dimension { get; }

    /// <summary>The build and search settings.</summary>
    public HnswParameters Parameters => _parameters;

    /// <inheritdoc />
    public int Count => Volatile.Read(ref _count);

    /// <inheritdoc />
    public int LiveCount => Volatile.Read(ref _live);

    /// <summary>The top layer currently in use (−1 when the graph has no live node).</summary>
    public int MaxLevel => Entry.Level;

    internal EntryPoint Entry => EntryPoint.Unpack(Volatile.Read(ref _entry));

    internal GraphState State => Volatile.Read(ref _state);

    /// <inheritdoc />
    public bool IsDeleted(int id)
    {
        GraphGuard.Id(id, Count);
        return State.Deleted[id];
    }

    /// <inheritdoc />
    public ReadOnlySpan<float> GetVector(int id)
    {
        GraphGuard.Id(id, Count);
        return new ArrayGraphView(State).Vector(id);
    }

    /// <summary>Top layer of node <paramref name="id"/>.</summary>
    public int LevelOf(int id)
    {
        GraphGuard.Id(id, Count);
        return State.Levels[id];
    }

    /// <inheritdoc />
    /// <remarks>Below <see cref="HnswParameters.ExactBelow"/> live nodes this scans every vector (exact).
    /// Thread safety: any thread, concurrently with other searches and with the writer.</remarks>
    public Neighbour[] Search(ReadOnlySpan<float> query, int k, int? ef = null)
    {
        GraphGuard.Query(query.Length, Dimension, k);
        var entry = Entry;
        int count = Count;
        var state = State;
        var scratch = SearchScratch.ForCurrentThread();
        var unit = scratch.NormalisedQuery(query);
        if (LiveCount <= _parameters.ExactBelow)
        {
            return ExactScan.TopK(state.Vectors, state.Deleted, Dimension, count, unit, k, scratch);
        }

        return HnswAlgorithm.Search(new ArrayGraphView(state), entry, unit, k, ef ?? _parameters.EfSearch, scratch);
    }

    /// <inheritdoc />
    /// <remarks>An expanding-ef graph search (see <see cref="HnswAlgorithm.RangeSearch{TView}"/> for its recall
    /// trade-off); exact below <see cref="HnswParameters.ExactBelow"/> live nodes.
    /// Thread safety: any thread, concurrently with other searches and with the writer.</remarks>
    public Neighbour[] RangeSearch(ReadOnlySpan<float> query, float radius)
    {
        GraphGuard.Query(query.Length, Dimension, 1);
        var entry = Entry;
        int count = Count;
        var state = State;
        var scratch = SearchScratch.ForCurrentThread();
        var unit = scratch.NormalisedQuery(query);
        int live = LiveCount;
        if (live <= _parameters.ExactBelow)
        {
            return ExactScan.Within(state.Vectors, state.Deleted, Dimension, count, unit, radius);
        }

        return HnswAlgorithm.RangeSearch(new ArrayGraphView(state), entry, unit, radius, _parameters.EfSearch, live, scratch);
    }

    private void MarkDirty(int id) => _dirty?.Add(id);
}

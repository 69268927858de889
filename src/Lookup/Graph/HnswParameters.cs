namespace Lookup.Graph;

/// <summary>
/// Build and search settings of an HNSW graph, named as in Malkov &amp; Yashunin (2018, "Efficient and robust
/// approximate nearest neighbor search using Hierarchical Navigable Small World graphs").
/// </summary>
/// <param name="M">Links a new node makes on every layer; layer 0 keeps up to <see cref="MaxM0"/> = 2·M.</param>
/// <param name="EfConstruction">Size of the dynamic candidate list while inserting.</param>
/// <param name="EfSearch">Default size of the dynamic candidate list while searching (raised to k when smaller).</param>
/// <param name="Seed">Seed of the level generator, so a build is reproducible.</param>
/// <param name="KeepPrunedConnections">The paper's Algorithm 4 option: top a node's list up to M with the closest
/// candidates the heuristic discarded.</param>
/// <param name="ExactBelow">While the graph holds at most this many live nodes, <c>Search</c> and <c>RangeSearch</c>
/// scan every vector instead of walking the graph: exact, and as fast or faster at that size (measured by
/// <c>Lookup.Bench graph</c>; see DEVELOPERS.md). 0 always walks the graph.</param>
public sealed record HnswParameters(
    int M = 16,
    int EfConstruction = 128,
    int EfSearch = 64,
    int Seed = 42,
    bool KeepPrunedConnections = true,
    int ExactBelow = HnswParameters.DefaultExactBelow)
{
    /// <summary>Live-node count up to which a brute-force scan is used (measured crossover, see DEVELOPERS.md).</summary>
    public const int DefaultExactBelow = 500;

    /// <summary>Maximum links per node on layer 0 (the paper's M_max0 = 2·M).</summary>
    public int MaxM0 => 2 * M;

    /// <summary>The level normalisation factor mL = 1 / ln M.</summary>
    public double LevelMultiplier => 1.0 / Math.Log(M);

    /// <summary>Maximum links per node on <paramref name="level"/>.</summary>
    public int MaxLinks(int level) => level == 0 ? MaxM0 : M;

    /// <summary>Throws when a value is out of range, naming the value and the allowed range.</summary>
    public void Validate()
    {
        if (M is < 2 or > 256)
        {
            throw new ArgumentOutOfRangeException(nameof(M), M, "M must be between 2 and 256 (16 is the usual choice).");
        }

        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(EfConstruction);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(EfSearch);
        ArgumentOutOfRangeException.ThrowIfNegative(ExactBelow);
    }
}

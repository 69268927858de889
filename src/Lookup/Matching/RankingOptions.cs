namespace Lookup.Matching;

/// <summary>Settings of <see cref="SkuRanker"/>; defaults are what <c>lookup match</c> uses.</summary>
internal sealed record RankingOptions
{
    /// <summary>Least number of photo hits asked of the graph per crop; raised to 4 × the rows wanted.</summary>
    public int MinHitsPerCrop { get; init; } = 32;

    /// <summary>
    /// Least number of candidate SKUs (nearest by their best hit) scored exactly against all their photos; raised
    /// to 3 × the rows wanted. Each costs a SKU lookup and a vector read per photo on a large index.
    /// </summary>
    public int MinSkusScored { get; init; } = 16;

    /// <summary>
    /// SKUs with more photos than this are scored on the photos the searches found, not on all of them, so one huge
    /// SKU cannot make a query read thousands of vectors.
    /// </summary>
    public int MaxPhotosScoredPerSku { get; init; } = 256;

    /// <summary>Searches run in parallel on this many threads (the persisted graph allows concurrent readers).</summary>
    public int Workers { get; init; } = Environment.ProcessorCount;

    public int HitsPerCrop(int top) => Math.Max(MinHitsPerCrop, 4 * top);

    public int SkusScored(int top) => Math.Max(MinSkusScored, 3 * top);
}

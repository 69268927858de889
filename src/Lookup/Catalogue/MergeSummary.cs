namespace Lookup.Catalogue;

/// <summary>What one merge did. Counts are photo records (paths); a photo found in several parts counts once in
/// the outcome columns and its other copies in <see cref="Superseded"/>.</summary>
internal sealed record MergeSummary
{
    public int Parts { get; init; }

    /// <summary>Photo records read from all parts.</summary>
    public int RecordsRead { get; init; }

    /// <summary>Paths the target did not hold.</summary>
    public int Added { get; init; }

    /// <summary>Paths whose content (SHA-256) differs from the target's and is newer: the old node is retired.</summary>
    public int Replaced { get; init; }

    /// <summary>Same content, newer record (SKU, size, time): record rewritten, node kept.</summary>
    public int Updated { get; init; }

    /// <summary>Already in the target as they are (merging a part twice lands here).</summary>
    public int Unchanged { get; init; }

    /// <summary>Older copies of a path that another part (or the target) holds in a newer version.</summary>
    public int Superseded { get; init; }

    /// <summary>True when the target had no graph and the whole graph was built in memory and saved in bulk.</summary>
    public bool BulkBuild { get; init; }

    /// <summary>Vectors inserted into the graph this run.</summary>
    public int VectorsInserted { get; init; }

    /// <summary>Vectors inserted per second of graph building.</summary>
    public double VectorsPerSecond { get; init; }

    public TimeSpan Elapsed { get; init; }

    public bool Cancelled { get; init; }

    /// <summary>Live graph nodes (indexed photos) in the target afterwards.</summary>
    public int IndexedTotal { get; init; }

    /// <summary>Photos recorded as failed in the target afterwards.</summary>
    public IReadOnlyList<IngestFailure> Failures { get; init; } = [];
}

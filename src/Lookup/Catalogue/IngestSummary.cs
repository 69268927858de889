namespace Lookup.Catalogue;

/// <summary>What one ingest run did.</summary>
internal sealed record IngestSummary
{
    public int Scanned { get; init; }
    public int New { get; init; }
    public int Changed { get; init; }
    public int Unchanged { get; init; }
    public int Moved { get; init; }
    public int Updated { get; init; }
    public int Retired { get; init; }
    public int KeptMissing { get; init; }
    public int Failed { get; init; }
    public int Unmapped { get; init; }
    public int OtherShards { get; init; }
    public int Embedded { get; init; }
    public TimeSpan Elapsed { get; init; }
    public bool Cancelled { get; init; }
    public int IndexedTotal { get; init; }

    /// <summary>Photos embedded per second of the embedding stage.</summary>
    public double PhotosPerSecond { get; init; }

    public IReadOnlyList<IngestFailure> Failures { get; init; } = [];
    public IReadOnlyList<MappingProblem> MappingProblems { get; init; } = [];
    public IReadOnlyList<ScanProblem> ScanProblems { get; init; } = [];
}

namespace Lookup.Sweeps;

/// <summary>Choices for one sweep of an index file (<see cref="IndexSweep.Run"/>).</summary>
public sealed record IndexSweepOptions
{
    /// <summary>Thresholds; null: the defaults, with the copy band taken from the index's verdict thresholds
    /// (calibrated or default, see <see cref="IndexSweep.EffectiveOptions"/>).</summary>
    public SweepOptions? Thresholds { get; init; }

    /// <summary>Report only findings the previous stored sweep did not have.</summary>
    public bool NewOnly { get; init; }

    /// <summary>Remember this sweep in the index (needs the writer lock for one short transaction).</summary>
    public bool Store { get; init; } = true;

    /// <summary>How long to wait for another writer (e.g. a running ingest) to release the index before giving up on
    /// storing; the sweep is reported either way.</summary>
    public TimeSpan StoreWait { get; init; } = TimeSpan.Zero;

    /// <summary>Threads; 0 means one per core.</summary>
    public int MaxDegreeOfParallelism { get; init; }
}

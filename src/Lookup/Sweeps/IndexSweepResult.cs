using Lookup.Calibration;
using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>What one sweep of an index found and whether it was remembered.</summary>
/// <param name="Report">The findings to report: reviewers' decisions applied, and with new-only, only new findings.</param>
/// <param name="NewKeys">Keys of the reported findings that the previous stored sweep did not have (all of them when
/// there was none).</param>
/// <param name="Previous">The stored sweep this one was compared with, or null.</param>
/// <param name="Number">The number this sweep was stored under; null when not stored.</param>
/// <param name="NotStoredReason">Why it was not stored (another writer, or not asked); null when stored.</param>
/// <param name="CatalogueRoot">The catalogue root recorded by ingest (paths are relative to it); null if unknown.</param>
/// <param name="PhotosWithoutSku">Indexed photos left out because they have no SKU.</param>
/// <param name="PhotosWithoutNode">Indexed photo records left out because their graph node is missing or retired.</param>
/// <param name="ReadTime">Reading photos and graph from the index.</param>
/// <param name="SweepTime">The sweep itself (neighbour search, classification, grouping).</param>
/// <param name="StoreTime">Storing it (including any wait for the writer lock).</param>
public sealed record IndexSweepResult(
    SweepReport Report,
    IReadOnlySet<string> NewKeys,
    StoredSweep? Previous,
    int? Number,
    string? NotStoredReason,
    string? CatalogueRoot,
    int PhotosWithoutSku,
    int PhotosWithoutNode,
    TimeSpan ReadTime,
    TimeSpan SweepTime,
    TimeSpan StoreTime)
{
    /// <summary>The index's last calibration (its histograms and bands, for the report), or null when it was never
    /// calibrated and the sweep used its default bands.</summary>
    public CalibrationRecord? Calibration { get; init; }

    /// <summary>True when the sweep is remembered in the index.</summary>
    public bool Stored => Number is not null;

    /// <summary>Reported findings of the given kinds that are new.</summary>
    public int NewFindings(IReadOnlySet<FindingKind> kinds)
    {
        ArgumentNullException.ThrowIfNull(kinds);
        return Report.Findings.Count(f => kinds.Contains(f.Kind) && NewKeys.Contains(f.Key));
    }
}

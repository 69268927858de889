using Lookup.Catalogue;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Demo;

/// <summary>Everything one demo tour did and how it scored against the truth file.</summary>
/// <param name="Options">What it worked on.</param>
/// <param name="Ingest">The ingest of the catalogue photos.</param>
/// <param name="Thresholds">The verdict thresholds the field photos were answered with.</param>
/// <param name="Field">One outcome per field photo, in the truth file's order.</param>
/// <param name="Sweep">The sweep of the index.</param>
/// <param name="Defects">One outcome per planted mistake, in the truth file's order.</param>
/// <param name="IngestTime">Wall time of the ingest (loading the model excluded).</param>
/// <param name="MatchTime">Wall time of matching every field photo.</param>
/// <param name="SweepTime">Wall time of the sweep.</param>
internal sealed record DemoTourResult(
    DemoTourOptions Options,
    IngestSummary Ingest,
    VerdictThresholds Thresholds,
    IReadOnlyList<FieldOutcome> Field,
    IndexSweepResult Sweep,
    IReadOnlyList<DefectOutcome> Defects,
    TimeSpan IngestTime,
    TimeSpan MatchTime,
    TimeSpan SweepTime)
{
    /// <summary>Field photos of stocked parts: the denominator of the accuracies.</summary>
    public int Stocked => Field.Count(f => f.Stocked);

    /// <summary>Stocked parts whose first SKU is the true one.</summary>
    public int TopOneRight => Field.Count(f => f.Stocked && f.Right);

    /// <summary>Stocked parts whose true SKU is among the first three.</summary>
    public int TopThreeRight => Field.Count(f => f.InTopThree == true);

    /// <summary>Parts not stocked that were answered "no match".</summary>
    public int NotStockedRight => Field.Count(f => !f.Stocked && f.Right);

    /// <summary>Planted mistakes the sweep reported.</summary>
    public int DefectsFound => Defects.Count(d => d.Found);

    /// <summary>Top-1 accuracy over stocked parts (0 when none).</summary>
    public double TopOneAccuracy => Stocked == 0 ? 0 : (double)TopOneRight / Stocked;

    /// <summary>Top-3 accuracy over stocked parts (0 when none).</summary>
    public double TopThreeAccuracy => Stocked == 0 ? 0 : (double)TopThreeRight / Stocked;
}

using LiteDB;
using Lookup.Store;

namespace Lookup.Calibration;

/// <summary>
/// The figures of the last calibration, kept in the index beside the thresholds (collection <c>calibrations</c>,
/// document <c>latest</c>) so that status can show them and reports can draw the histograms
/// (<see cref="CalibrationPlot.RenderPng(CalibrationRecord, int, int)"/>) without calibrating again.
/// </summary>
public sealed record CalibrationRecord
{
    private const string CollectionName = "calibrations";
    private const string Id = "latest";

    /// <summary>When calibrate measured.</summary>
    public DateTime CalibratedUtc { get; init; }

    /// <summary>Upper limit of the copy band.</summary>
    public float Copy { get; init; }

    /// <summary>Upper limit of the same-part band.</summary>
    public float SamePart { get; init; }

    /// <summary>Target share of strangers inside the copy band.</summary>
    public double TargetFalseMatchRate { get; init; }

    /// <summary>Share of strangers allowed inside the same-part band.</summary>
    public double SamePartFalseMatchRate { get; init; }

    /// <summary>The seed used.</summary>
    public int Seed { get; init; }

    /// <summary>Photos that got copies.</summary>
    public int PhotosSampled { get; init; }

    /// <summary>Copies measured.</summary>
    public int Copies { get; init; }

    /// <summary>Held-out copies inside the copy band.</summary>
    public RateCount CopiesInCopyBand { get; init; }

    /// <summary>Held-out stranger pairs inside the copy band (the measured false-match rate).</summary>
    public RateCount StrangersInCopyBand { get; init; }

    /// <summary>Held-out stranger pairs inside the same-part band or closer.</summary>
    public RateCount StrangersInSamePartBand { get; init; }

    /// <summary>Held-out sibling pairs inside the same-part band or closer.</summary>
    public RateCount SiblingsInSamePartBand { get; init; }

    /// <summary>All measured distances in bins.</summary>
    public required DistanceHistograms Histograms { get; init; }

    /// <summary>The record of a calibration result.</summary>
    public static CalibrationRecord From(CalibrationResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        return new CalibrationRecord
        {
            CalibratedUtc = result.Thresholds.CalibratedUtc ?? DateTime.UtcNow,
            Copy = result.Limits.Copy,
            SamePart = result.Limits.SamePart,
            TargetFalseMatchRate = result.Options.TargetFalseMatchRate,
            SamePartFalseMatchRate = result.Options.SamePartFalseMatchRate,
            Seed = result.Options.Seed,
            PhotosSampled = result.Thresholds.SampleSize,
            Copies = result.Copies,
            CopiesInCopyBand = result.Measured.CopiesInCopyBand,
            StrangersInCopyBand = result.Measured.StrangersInCopyBand,
            StrangersInSamePartBand = result.Measured.StrangersInSamePartBand,
            SiblingsInSamePartBand = result.Measured.SiblingsInSamePartBand,
            Histograms = result.Histograms,
        };
    }

    /// <summary>The last calibration stored in <paramref name="file"/>, or null when there is none (or it cannot be read).</summary>
    public static CalibrationRecord? Read(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        if (!file.Database.CollectionExists(CollectionName) || file.Database.GetCollection(CollectionName).FindById(Id) is not { } doc)
        {
            return null;
        }

        try
        {
            return new CalibrationRecord
            {
                CalibratedUtc = doc["at"].AsDateTime.ToUniversalTime(),
                Copy = (float)doc["copy"].AsDouble,
                SamePart = (float)doc["same"].AsDouble,
                TargetFalseMatchRate = doc["target"].AsDouble,
                SamePartFalseMatchRate = doc["targetSame"].AsDouble,
                Seed = doc["seed"].AsInt32,
                PhotosSampled = doc["sampled"].AsInt32,
                Copies = doc["copies"].AsInt32,
                CopiesInCopyBand = Rate(doc["copiesCopy"]),
                StrangersInCopyBand = Rate(doc["strangersCopy"]),
                StrangersInSamePartBand = Rate(doc["strangersSame"]),
                SiblingsInSamePartBand = Rate(doc["siblingsSame"]),
                Histograms = new DistanceHistograms(
                    (float)doc["bin"].AsDouble, Counts(doc["hCopies"]), Counts(doc["hSiblings"]), Counts(doc["hStrangers"])),
            };
        }
        catch (Exception e) when (e is InvalidCastException or NullReferenceException or KeyNotFoundException)
        {
            return null;
        }
    }

    /// <summary>Stores this record in <paramref name="file"/>, replacing the previous one (joins the caller's transaction).</summary>
    public void Write(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        file.RequireWritable();
        file.Database.GetCollection(CollectionName).Upsert(new BsonDocument
        {
            ["_id"] = Id,
            ["at"] = CalibratedUtc,
            ["copy"] = (double)Copy,
            ["same"] = (double)SamePart,
            ["target"] = TargetFalseMatchRate,
            ["targetSame"] = SamePartFalseMatchRate,
            ["seed"] = Seed,
            ["sampled"] = PhotosSampled,
            ["copies"] = Copies,
            ["copiesCopy"] = Rate(CopiesInCopyBand),
            ["strangersCopy"] = Rate(StrangersInCopyBand),
            ["strangersSame"] = Rate(StrangersInSamePartBand),
            ["siblingsSame"] = Rate(SiblingsInSamePartBand),
            ["bin"] = (double)Histograms.BinWidth,
            ["hCopies"] = Counts(Histograms.Copies),
            ["hSiblings"] = Counts(Histograms.Siblings),
            ["hStrangers"] = Counts(Histograms.Strangers),
        });
    }

    private static BsonArray Rate(RateCount rate) => [rate.Inside, rate.Total];

    private static RateCount Rate(BsonValue value) => new(value.AsArray[0].AsInt32, value.AsArray[1].AsInt32);

    private static BsonArray Counts(int[] counts) => new(counts.Select(c => new BsonValue(c)));

    private static int[] Counts(BsonValue value) => value.AsArray.Select(v => v.AsInt32).ToArray();
}

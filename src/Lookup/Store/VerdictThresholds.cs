using LiteDB;

namespace Lookup.Store;

/// <summary>
/// Cosine-distance limits of the verdict bands, shared by match, sweep and calibrate: a distance at or below
/// <see cref="Copy"/> reads as the same photo (edited or re-encoded), at or below <see cref="SamePart"/> as probably
/// the same part, above it as no match. Identical bytes or pixels are decided by hashes, not by these.
/// Stored in the index by calibrate; until then <see cref="Default"/> applies.
/// </summary>
/// <param name="Copy">Upper distance of the copy band.</param>
/// <param name="SamePart">Upper distance of the same-part band (≥ <paramref name="Copy"/>).</param>
/// <param name="MinMargin">Least relative margin between the best and the second-best SKU, (d2 − d1) / d2, for a
/// same-part answer to stand (a ratio test in the spirit of Lowe 2004); below it the answer is "unsure".</param>
/// <param name="Source">Where the numbers come from: "default" or "calibrated".</param>
/// <param name="CalibratedUtc">When calibrate measured them; null for defaults.</param>
/// <param name="SampleSize">Photos calibrate sampled; 0 for defaults.</param>
/// <param name="PhotosAtCalibration">Indexed photos when calibrated, so status can say the index has grown since.</param>
/// <param name="ModelFingerprint">The model they were measured with; null for defaults.</param>
/// <param name="TargetFalseMatchRate">The false-match rate calibrate aimed for; 0 for defaults.</param>
public sealed record VerdictThresholds(
    float Copy,
    float SamePart,
    float MinMargin,
    string Source,
    DateTime? CalibratedUtc = null,
    int SampleSize = 0,
    int PhotosAtCalibration = 0,
    string? ModelFingerprint = null,
    double TargetFalseMatchRate = 0)
{
    private const string CollectionName = "catalogue_meta";
    private const string Id = "thresholds";

    /// <summary>
    /// Defaults for ResNet18 until an index is calibrated, measured with <c>tools/MatchBench eval</c> (DEVELOPERS.md,
    /// section Matching; dense crops). Copy 0.22: Copydays-style copies of the reference photos (JPEG q30, 50 % crop,
    /// 25 % resize, brightness) lie 0.003–0.215 from their originals. Same part 0.24: the largest distance at which
    /// none of the held-out reference photos (nearest 0.246), their bench snapshots (nearest 0.262) or the demo's
    /// unstocked field photos (nearest 0.333) is answered; it keeps 98 % of the whole-photo reference answers and
    /// 20 % of the bench snapshots as sure answers (the rest come back as no match, none wrong). Margin 0.10: on the
    /// demo's look-alike SKUs, 0.05 let two wrong answers through as sure and 0.10 one.
    /// </summary>
    public static VerdictThresholds Default { get; } = new(Copy: 0.22f, SamePart: 0.24f, MinMargin: 0.10f, Source: "default");

    /// <summary>The thresholds stored in <paramref name="file"/>, or <see cref="Default"/>.</summary>
    public static VerdictThresholds ReadOrDefault(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        if (!file.Database.CollectionExists(CollectionName))
        {
            return Default;
        }

        var doc = file.Database.GetCollection(CollectionName).FindById(Id);
        return doc is null
            ? Default
            : new VerdictThresholds(
                (float)doc["copy"].AsDouble,
                (float)doc["same"].AsDouble,
                (float)doc["margin"].AsDouble,
                doc["source"].AsString,
                doc["at"].IsNull ? null : doc["at"].AsDateTime.ToUniversalTime(),
                doc["n"].AsInt32,
                doc["photos"].AsInt32,
                doc["fp"].IsNull ? null : doc["fp"].AsString,
                doc["target"].AsDouble);
    }

    /// <summary>Stores these thresholds in <paramref name="file"/> (joins the caller's transaction).</summary>
    public void Write(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        file.RequireWritable();
        file.Database.GetCollection(CollectionName).Upsert(new BsonDocument
        {
            ["_id"] = Id,
            ["copy"] = (double)Copy,
            ["same"] = (double)SamePart,
            ["margin"] = (double)MinMargin,
            ["source"] = Source,
            ["at"] = CalibratedUtc is DateTime at ? at : BsonValue.Null,
            ["n"] = SampleSize,
            ["photos"] = PhotosAtCalibration,
            ["fp"] = ModelFingerprint is null ? BsonValue.Null : ModelFingerprint,
            ["target"] = TargetFalseMatchRate,
        });
    }
}

using System.Globalization;
using LiteDB;
using Lookup.Store;

namespace Lookup.Calibration;

/// <summary>
/// A summary of one index for <c>lookup status</c>: photos, SKUs, graph, model, catalogue, thresholds and the last
/// sweep, with warnings when the thresholds no longer describe the index (grown, shrunk, or another model).
/// It lives beside calibration because its main question is whether the thresholds still hold.
/// </summary>
public sealed record IndexStatus
{
    /// <summary>A change in indexed photos beyond this share since calibration earns a warning.</summary>
    public const double ChangeWarningShare = 0.2;

    private const string SweepsCollection = "sweeps";

    /// <summary>The index file.</summary>
    public required string IndexPath { get; init; }

    /// <summary>Index schema version.</summary>
    public int SchemaVersion { get; init; }

    /// <summary>Photos embedded and in the graph.</summary>
    public int PhotosIndexed { get; init; }

    /// <summary>Photos recorded as failed.</summary>
    public int PhotosFailed { get; init; }

    /// <summary>Indexed photos with no SKU.</summary>
    public int PhotosWithoutSku { get; init; }

    /// <summary>Distinct SKUs of indexed photos.</summary>
    public int Skus { get; init; }

    /// <summary>Graph nodes, live and retired.</summary>
    public int GraphNodes { get; init; }

    /// <summary>Live graph nodes.</summary>
    public int GraphLive { get; init; }

    /// <summary>Embedding length, 0 without a graph.</summary>
    public int Dimension { get; init; }

    /// <summary>Name in the stored model card, null before the first ingest.</summary>
    public string? ModelName { get; init; }

    /// <summary>Fingerprint of the graph's model, null without a graph.</summary>
    public string? ModelFingerprint { get; init; }

    /// <summary>Catalogue folder last ingested.</summary>
    public string? CatalogueRoot { get; init; }

    /// <summary>Whether <see cref="CatalogueRoot"/> exists on this machine.</summary>
    public bool CatalogueRootFound { get; init; }

    /// <summary>The SKU mapping spec of the last ingest.</summary>
    public string? SkuMapping { get; init; }

    /// <summary>When ingest last wrote its settings.</summary>
    public DateTime? LastIngestUtc { get; init; }

    /// <summary>The thresholds in force (stored, or the defaults).</summary>
    public required VerdictThresholds Thresholds { get; init; }

    /// <summary>The last calibration's figures, when calibrate has run.</summary>
    public CalibrationRecord? Calibration { get; init; }

    /// <summary>Stored sweeps, 0 when there are none (or they cannot be read).</summary>
    public int Sweeps { get; init; }

    /// <summary>The latest time found in the stored sweeps, or null.</summary>
    public DateTime? LastSweepUtc { get; init; }

    /// <summary>What needs attention.</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];

    /// <summary>Graph nodes retired (deleted) but still in the file.</summary>
    public int GraphDeleted => GraphNodes - GraphLive;

    /// <summary>Reads the status of <paramref name="file"/> (a reader handle will do).</summary>
    public static IndexStatus Read(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        int indexed = 0, failed = 0, noSku = 0;
        var skus = new HashSet<string>(StringComparer.Ordinal);
        foreach (var photo in new PhotoTable(file).All())
        {
            if (photo.Status == PhotoStatus.Failed)
            {
                failed++;
                continue;
            }

            indexed++;
            if (string.IsNullOrEmpty(photo.Sku))
            {
                noSku++;
            }
            else
            {
                skus.Add(photo.Sku);
            }
        }

        var store = new GraphStore(file);
        var graph = store.HasGraph ? store.OpenLazy() : null;
        var settings = CatalogueSettings.Read(file);
        var (sweeps, lastSweep) = ReadSweeps(file);
        var status = new IndexStatus
        {
            IndexPath = file.Path,
            SchemaVersion = file.SchemaVersion,
            PhotosIndexed = indexed,
            PhotosFailed = failed,
            PhotosWithoutSku = noSku,
            Skus = skus.Count,
            GraphNodes = graph?.Count ?? 0,
            GraphLive = graph?.LiveCount ?? 0,
            Dimension = graph?.Dimension ?? 0,
            ModelName = settings is null ? null : IndexModelCard.Name(settings.ModelCardJson),
            ModelFingerprint = graph?.ModelFingerprint ?? settings?.ModelFingerprint,
            CatalogueRoot = settings?.CatalogueRoot,
            CatalogueRootFound = settings is not null && Directory.Exists(settings.CatalogueRoot),
            SkuMapping = settings?.SkuMapping,
            LastIngestUtc = settings?.UpdatedUtc,
            Thresholds = VerdictThresholds.ReadOrDefault(file),
            Calibration = CalibrationRecord.Read(file),
            Sweeps = sweeps,
            LastSweepUtc = lastSweep,
        };
        return status with { Warnings = WarningsFor(status) };
    }

    private static List<string> WarningsFor(IndexStatus s)
    {
        var warnings = new List<string>();
        string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
        if (s.ModelFingerprint is null)
        {
            warnings.Add($"{s.IndexPath} holds no catalogue yet: run 'lookup ingest PHOTO-TREE --index {s.IndexPath}'.");
            return warnings;
        }

        if (!s.CatalogueRootFound)
        {
            warnings.Add($"The catalogue folder {s.CatalogueRoot} is not there: matching still works from the index, but sweep reports, calibrate and the next ingest need the photos. Mount it at that path or ingest from its new place.");
        }

        if (s.PhotosFailed > 0)
        {
            warnings.Add(F($"{s.PhotosFailed:N0} photos failed and are not searchable; 'lookup ingest {s.CatalogueRoot} --index {s.IndexPath} --json' lists them with reasons."));
        }

        var t = s.Thresholds;
        if (t.Source != "calibrated")
        {
            warnings.Add(F($"Not calibrated: match and sweep use the {t.Source} thresholds, measured on reference photos rather than this catalogue. Run 'lookup calibrate --index {s.IndexPath}'."));
            return warnings;
        }

        if (t.ModelFingerprint != s.ModelFingerprint)
        {
            warnings.Add($"The thresholds were measured with another model (fingerprint {IndexModelCard.Short(t.ModelFingerprint)}) than the index now holds ({IndexModelCard.Short(s.ModelFingerprint)}): distances are not comparable. Run 'lookup calibrate --index {s.IndexPath}' again.");
        }

        if (t.PhotosAtCalibration > 0)
        {
            double change = (double)(s.PhotosIndexed - t.PhotosAtCalibration) / t.PhotosAtCalibration;
            if (Math.Abs(change) > ChangeWarningShare)
            {
                warnings.Add(F($"The index has {(change > 0 ? "grown" : "shrunk")} by {Math.Abs(change):0 %} since calibration ({t.PhotosAtCalibration:N0} → {s.PhotosIndexed:N0} photos): run 'lookup calibrate --index {s.IndexPath}' again."));
            }
        }

        return warnings;
    }

    /// <summary>
    /// Counts the documents of the <c>sweeps</c> collection and takes the latest date found in their top-level
    /// fields. Sweeps are written by another part of the program; nothing about their layout is assumed beyond that.
    /// </summary>
    private static (int Count, DateTime? Latest) ReadSweeps(IndexFile file)
    {
        try
        {
            if (!file.Database.CollectionExists(SweepsCollection))
            {
                return (0, null);
            }

            int count = 0;
            DateTime? latest = null;
            foreach (var doc in file.Database.GetCollection(SweepsCollection).FindAll())
            {
                count++;
                foreach (var value in doc.Values)
                {
                    if (value.IsDateTime && (latest is null || value.AsDateTime.ToUniversalTime() > latest))
                    {
                        latest = value.AsDateTime.ToUniversalTime();
                    }
                }
            }

            return (count, latest);
        }
        catch (Exception e) when (e is LiteException or InvalidCastException)
        {
            return (0, null);
        }
    }
}

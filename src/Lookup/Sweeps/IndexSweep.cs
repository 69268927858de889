using System.Diagnostics;
using Lookup.Calibration;
using Lookup.Graph;
using Lookup.Imaging;
using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>
/// A sweep of an index file: the bridge between <see cref="SweepEngine"/> (which knows nothing of files) and the
/// index. Reads a snapshot, sweeps it, applies reviewers' decisions and the previous sweep, stores the result.
/// <para>
/// Locking: the photos, graph, decisions and previous sweep are read from a read-only snapshot
/// (<see cref="IndexAccess.Read"/>), so a sweep runs beside an ingest that is writing and never blocks one; the
/// snapshot is closed before the sweep starts. Storing takes the writer lock for one short transaction. When another
/// process holds it (an ingest), the sweep waits up to <see cref="IndexSweepOptions.StoreWait"/> and otherwise is
/// reported without being stored (<see cref="IndexSweepResult.NotStoredReason"/> says who holds the lock). Nothing is
/// lost that way: the next sweep compares with the last stored one, so whatever was new now is new again then.
/// </para>
/// Thread safety: concurrent runs are safe; each is parallel over the cores.
/// </summary>
public static partial class IndexSweep
{
    /// <summary>Sweeps the index at <paramref name="indexPath"/>.</summary>
    /// <param name="indexPath">The index file.</param>
    /// <param name="options">What to report and whether to store; defaults when null.</param>
    /// <param name="progress">Stage messages ("reading ...", "sweeping ...", "storing ...").</param>
    /// <param name="clock">The clock for the report's times; the system clock when null.</param>
    /// <param name="cancellationToken">Stops the sweep.</param>
    /// <exception cref="IndexFileException">The index is missing, damaged, newer, or has no graph.</exception>
    public static IndexSweepResult Run(
        string indexPath,
        IndexSweepOptions? options = null,
        IProgress<string>? progress = null,
        TimeProvider? clock = null,
        CancellationToken cancellationToken = default)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(indexPath);
        options ??= new IndexSweepOptions();
        var watch = Stopwatch.StartNew();
        progress?.Report($"reading {indexPath}");
        var snapshot = Snapshot.Read(indexPath, options);
        var readTime = watch.Elapsed;

        progress?.Report($"sweeping {snapshot.Photos.Count} photos");
        var full = SweepEngine.Run(
            snapshot.Photos,
            new GraphNeighbourSource(snapshot.Graph),
            snapshot.Options with { MaxDegreeOfParallelism = options.MaxDegreeOfParallelism },
            thumbnails: null,
            FinishesOnDisk(snapshot.CatalogueRoot),
            clock,
            cancellationToken);
        var decided = full.Filtered(snapshot.Decisions, previousKeys: null);
        var newKeys = decided.Findings.Select(f => f.Key).Where(k => !snapshot.PreviousKeys.Contains(k)).ToHashSet(StringComparer.Ordinal);
        var reported = options.NewOnly ? full.Filtered(snapshot.Decisions, snapshot.PreviousKeys) : decided;
        var sweepTime = watch.Elapsed - readTime;

        int? number = null;
        string? notStored = "storing was not asked for";
        if (options.Store)
        {
            progress?.Report("storing the sweep");
            (number, notStored) = Store(indexPath, decided, newKeys.Count, options.StoreWait, cancellationToken);
        }

        return new IndexSweepResult(
            reported, newKeys, snapshot.Previous, number, notStored, snapshot.CatalogueRoot, snapshot.WithoutSku,
            snapshot.WithoutNode, readTime, sweepTime, watch.Elapsed - readTime - sweepTime)
        {
            Calibration = snapshot.Calibration,
        };
    }

    /// <summary>
    /// Measures each photo's finish from its file under the catalogue root (decoded within the default
    /// <see cref="PhotoLimits"/>), or gives none when the root is unknown; a file that is gone or cannot be decoded
    /// has no finish and is left out of the finish check. Cost: one decode per photo per sweep (about 3 ms for a
    /// 384 × 384 JPEG).
    /// </summary>
    private static FinishSource? FinishesOnDisk(string? catalogueRoot)
    {
        if (catalogueRoot is null || !Directory.Exists(catalogueRoot))
        {
            return null;
        }

        var decoder = new PhotoDecoder();
        return photo =>
        {
            var path = Path.Combine(catalogueRoot, photo.Path.Replace('/', Path.DirectorySeparatorChar));
            if (!File.Exists(path))
            {
                return null;
            }

            try
            {
                using var decoded = decoder.Decode(path);
                return FinishSignature.Of(decoded.Image);
            }
            catch (PhotoRejectedException)
            {
                return null;
            }
        };
    }

    /// <summary>
    /// The thresholds a sweep of <paramref name="file"/> uses by default: <see cref="SweepOptions"/>' defaults with
    /// the copy band (<see cref="SweepOptions.CopyMaxDistance"/>) from the index's <see cref="VerdictThresholds.Copy"/>,
    /// the distance match and calibrate also call "the same photo, edited" (0.25 by default, as the sweep's own
    /// default). The crop and same-pixel limits are capped at it. <see cref="VerdictThresholds.SamePart"/> is not used
    /// for look-alikes: it answers "is the photo I hold probably this part?" (0.40), while a sweep's look-alike says
    /// "two SKUs may be one part", which needs the much closer 0.10 (project figures: different similar products from
    /// 0.07); at 0.40 the sweep would also search four times the radius and report most of a catalogue of similar parts.
    /// </summary>
    public static SweepOptions EffectiveOptions(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        var thresholds = VerdictThresholds.ReadOrDefault(file);
        var defaults = new SweepOptions();
        // Until calibrate has measured this catalogue, the sweep keeps its own measured defaults: the shared
        // default copy band is tuned for match (whole photo and crops against a catalogue), not for pairs of
        // catalogue photos.
        if (ReferenceEquals(thresholds, VerdictThresholds.Default))
        {
            return defaults;
        }

        var copy = thresholds.Copy;
        return defaults with
        {
            CopyMaxDistance = copy,
            CropMaxDistance = Math.Min(defaults.CropMaxDistance, copy),
            SamePixelsMaxDistance = Math.Min(defaults.SamePixelsMaxDistance, copy),
        };
    }

    /// <summary>The decisions stored in <paramref name="file"/> as the engine's <see cref="ReviewDecisions"/>.</summary>
    public static ReviewDecisions DecisionsOf(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        var all = new DecisionStore(file).All();
        return new ReviewDecisions(
            all.Where(d => d.Target == DecisionTarget.Pair).Select(d => d.Key),
            all.Where(d => d.Target == DecisionTarget.Finding).Select(d => d.Key));
    }

    /// <summary>What a sweep reads from the index, in one read-only snapshot closed before the sweep starts.</summary>
    private sealed record Snapshot(
        List<SweepPhoto> Photos,
        HnswGraph Graph,
        SweepOptions Options,
        ReviewDecisions Decisions,
        StoredSweep? Previous,
        IReadOnlySet<string> PreviousKeys,
        string? CatalogueRoot,
        int WithoutSku,
        int WithoutNode,
        CalibrationRecord? Calibration)
    {
        public static Snapshot Read(string indexPath, IndexSweepOptions options)
        {
            using var file = IndexFile.Open(indexPath, IndexAccess.Read);
            var graph = new GraphStore(file).Load();
            var (photos, withoutSku, withoutNode) = IndexPhotos.Read(new PhotoTable(file).All(), graph);
            var sweeps = new SweepStore(file);
            var previous = sweeps.Latest();
            return new Snapshot(
                photos,
                graph,
                options.Thresholds ?? EffectiveOptions(file),
                DecisionsOf(file),
                previous,
                previous is null ? new HashSet<string>() : sweeps.KeysOf(previous.Number),
                CatalogueSettings.Read(file)?.CatalogueRoot,
                withoutSku,
                withoutNode,
                ReferenceEquals(VerdictThresholds.ReadOrDefault(file), VerdictThresholds.Default) ? null : CalibrationRecord.Read(file));
        }
    }
}

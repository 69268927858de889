using System.Diagnostics;
using Lookup.Catalogue;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Matching;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Demo;

/// <summary>
/// The whole job on the demo catalogue, through the same engine entry points as the commands: ingest the catalogue
/// photos (<see cref="CatalogueIngest"/>, SKU from the folder name), answer every field photo on its own
/// (<see cref="PartMatcher"/>), sweep the index (<see cref="IndexSweep"/>), then score the answers and the findings
/// against <c>truth.json</c>. Thread safety: one run at a time per index.
/// </summary>
internal sealed class DemoTour(ImageEmbedder embedder)
{
    /// <exception cref="DemoTruthException">The truth file is missing or unreadable.</exception>
    /// <exception cref="IndexFileException">The index cannot be written or read, or was built with another model.</exception>
    /// <exception cref="OperationCanceledException">Stopped before the sweep finished.</exception>
    public DemoTourResult Run(DemoTourOptions options, IProgress<string>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(options);
        var truth = DemoTruth.Load(options.DemoFolder);
        var photos = Path.Combine(Path.GetFullPath(options.DemoFolder), DemoTruth.PhotosFolder);

        var watch = Stopwatch.StartNew();
        progress?.Report($"indexing the catalogue photos in {photos}");
        IngestSummary ingest;
        using (var file = IndexFile.Open(options.IndexPath, IndexAccess.Write))
        {
            ingest = new CatalogueIngest(file, embedder).Run(
                new IngestOptions { Root = photos, Workers = options.Workers }, cancellationToken: cancellationToken);
        }

        cancellationToken.ThrowIfCancellationRequested();
        var ingestTime = watch.Elapsed;

        watch.Restart();
        progress?.Report($"matching {truth.Field.Count} field photos");
        VerdictThresholds thresholds;
        List<FieldOutcome> field;
        using (var index = MatchIndex.Open(options.IndexPath))
        {
            thresholds = index.Thresholds;
            var paths = truth.Field.Select(f => InDemoFolder(options.DemoFolder, f.File)).ToList();
            var run = new PartMatcher(index, new PhotoDecoder()).MatchFiles(
                paths, new MatchRequest(options.Top, options.Crops, Each: true, options.Workers), () => embedder);
            var answers = run.Answers.ToDictionary(a => a.Photos[0], StringComparer.Ordinal);
            var failures = run.Failures.ToDictionary(f => f.Photo, f => f.Message, StringComparer.Ordinal);
            field = [.. truth.Field.Select((f, i) => new FieldOutcome(
                f,
                answers.TryGetValue(paths[i], out var answer) ? answer.Ranking : [],
                failures.GetValueOrDefault(paths[i])))];
        }

        var matchTime = watch.Elapsed;

        watch.Restart();
        var sweep = IndexSweep.Run(
            options.IndexPath,
            new IndexSweepOptions { MaxDegreeOfParallelism = options.Workers },
            progress,
            cancellationToken: cancellationToken);
        var sweepTime = watch.Elapsed;

        string ToIndexPath(string file) =>
            Path.GetRelativePath(photos, InDemoFolder(options.DemoFolder, file)).Replace(Path.DirectorySeparatorChar, '/');
        var defects = truth.Defects.Select(d => DefectCheck.Check(d, sweep.Report, ToIndexPath)).ToList();
        return new DemoTourResult(options, ingest, thresholds, field, sweep, defects, ingestTime, matchTime, sweepTime);
    }

    private static string InDemoFolder(string demoFolder, string file) =>
        Path.Combine(Path.GetFullPath(demoFolder), file.Replace('/', Path.DirectorySeparatorChar));
}

using System.Diagnostics;
using Lookup.Embedding;
using Lookup.Graph;
using Lookup.Imaging;
using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>
/// Brings an index up to date with a photo tree: scan, map to SKUs, plan against what the index knows, apply the
/// cheap changes (moves, SKU changes, retirements), then embed new and changed photos on N workers feeding one
/// writer that commits photo records and graph nodes together, batch by batch.
/// </summary>
/// <remarks>
/// Crash safety: every batch is one transaction holding both the photo records and the graph nodes they point
/// to, so after a kill the index holds whole batches only, and the next run sees the missing photos as new and
/// embeds them once. Nothing is ever deleted before its replacement is in the same transaction.
/// Thread safety: one run per index (the index file's writer lock enforces it).
/// </remarks>
internal sealed class CatalogueIngest(IndexFile index, ImageEmbedder embedder, TimeProvider? clock = null)
{
    private readonly TimeProvider _clock = clock ?? TimeProvider.System;

    /// <summary>Runs one ingest. Cancellation stops dispatching photos, commits what was done and returns a
    /// summary with <see cref="IngestSummary.Cancelled"/> set.</summary>
    /// <exception cref="IndexFileException">The index was built with another model.</exception>
    /// <exception cref="SkuMappingException">The SKU mapping spec or its CSV is unusable.</exception>
    public IngestSummary Run(IngestOptions options, IProgress<IngestProgress>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(options);
        var started = Stopwatch.StartNew();
        string root = Path.GetFullPath(options.Root);
        var mapping = SkuMapping.Parse(options.SkuMapping, Environment.CurrentDirectory);
        progress?.Report(new IngestProgress("scanning", 0, 0, 0));
        var scan = new CatalogueScanner().Scan(root, cancellationToken);
        var mapped = mapping.Map(scan.Entries);
        var inShard = mapped.Photos.Where(p => options.Shard?.Contains(p.Entry.RelativePath) ?? true).ToList();

        var photos = new PhotoTable(index);
        var graphStore = new GraphStore(index);
        var graph = OpenGraph(graphStore, options);
        var known = photos.All().Select(ToKnown).ToList();
        var plan = new ChangePlanner().Plan(
            known, inShard, scan.Unreadable, new ChangePlanOptions { KeepMissing = options.KeepMissing }, cancellationToken);

        var summary = new Tally();
        var jobs = new List<PhotoJob>();
        index.InTransaction(() =>
        {
            new CatalogueSettings(root, mapping.Spec, embedder.Card.ToJson(), embedder.Fingerprint, Now()).Write(index);
            foreach (var item in plan.Items)
            {
                ApplyCheapChange(item, photos, graph, jobs, summary, options);
            }

            graphStore.Commit(graph);
        });

        var failures = new List<IngestFailure>();
        var embeddingClock = Stopwatch.StartNew();
        var worker = new PhotoWorker(new PhotoDecoder(options.Limits), embedder, _clock);
        int done = 0;
        bool cancelled = false;
        progress?.Report(new IngestProgress("embedding", 0, jobs.Count, 0));
        try
        {
            WorkerPipeline.Run(jobs, options.Workers, options.BatchSize, TimeSpan.FromSeconds(2), worker.Process, batch =>
            {
                index.InTransaction(() =>
                {
                    foreach (var outcome in batch)
                    {
                        Store(outcome, photos, graph, failures);
                    }

                    graphStore.Commit(graph);
                });
                done += batch.Count;
                summary.Embedded += batch.Count(o => o.Embedding is not null);
                progress?.Report(new IngestProgress("embedding", done, jobs.Count, failures.Count));
            }, cancellationToken);
        }
        catch (OperationCanceledException)
        {
            cancelled = true;
        }

        double seconds = embeddingClock.Elapsed.TotalSeconds;
        return new IngestSummary
        {
            Scanned = scan.Entries.Count,
            New = summary.New,
            Changed = summary.Changed,
            Unchanged = summary.Unchanged,
            Moved = summary.Moved,
            Updated = summary.Updated,
            Retired = summary.Retired,
            KeptMissing = summary.KeptMissing,
            Failed = failures.Count + summary.FailedBeforeEmbedding.Count,
            Unmapped = summary.Unmapped,
            OtherShards = mapped.Photos.Count - inShard.Count,
            Embedded = summary.Embedded,
            Elapsed = started.Elapsed,
            Cancelled = cancelled,
            IndexedTotal = graph.LiveCount,
            PhotosPerSecond = seconds > 0 ? done / seconds : 0,
            Failures = [.. summary.FailedBeforeEmbedding, .. failures],
            MappingProblems = mapped.Problems,
            ScanProblems = scan.Problems,
        };
    }

    private HnswGraph OpenGraph(GraphStore graphStore, IngestOptions options)
    {
        if (!graphStore.HasGraph)
        {
            return graphStore.Create(embedder.Dimension, options.Graph, embedder.Fingerprint);
        }

        string stored = graphStore.ModelFingerprint ?? "";
        if (stored != embedder.Fingerprint)
        {
            var settings = CatalogueSettings.Read(index);
            string builtWith = settings is null ? "another model" : $"model card '{ModelName(settings.ModelCardJson)}'";
            throw new IndexFileException(index.Path, IndexFileProblem.ModelMismatch,
                $"{index.Path} was built with {builtWith} (fingerprint {Short(stored)}), this run uses '{embedder.Card.Name}' " +
                $"(fingerprint {Short(embedder.Fingerprint)}): ingest with the index's model card (--model) or into a new index file.");
        }

        return graphStore.Load(embedder.Fingerprint);
    }

    private void ApplyCheapChange(PlannedChange item, PhotoTable photos, HnswGraph graph, List<PhotoJob> jobs, Tally tally, IngestOptions options)
    {
        var known = item.Known;
        switch (item.Kind)
        {
            case ChangeKind.Unchanged when options.RetryFailed && known?.Status == KnownPhotoStatus.Failed && item.Current is not null:
                jobs.Add(new PhotoJob(item.Current, null, null));
                tally.Changed++;
                break;
            case ChangeKind.Unchanged:
                tally.Unchanged++;
                break;
            case ChangeKind.Touched or ChangeKind.SkuChanged:
                photos.Upsert(photos.Find(item.RelativePath)! with
                {
                    Sku = item.Sku,
                    Size = item.Current!.Entry.Size,
                    MtimeUtcTicks = item.Current.Entry.MtimeUtcTicks,
                    UpdatedUtc = Now(),
                });
                tally.Updated++;
                break;
            case ChangeKind.Moved:
                var old = photos.Find(known!.RelativePath)!;
                photos.Delete(old.Path);
                photos.Upsert(old with
                {
                    Path = item.RelativePath,
                    Sku = item.Sku,
                    Size = item.Current!.Entry.Size,
                    MtimeUtcTicks = item.Current.Entry.MtimeUtcTicks,
                    UpdatedUtc = Now(),
                });
                tally.Moved++;
                break;
            case ChangeKind.Changed:
                jobs.Add(new PhotoJob(item.Current!, item.Sha256, ToNode(known)));
                tally.Changed++;
                break;
            case ChangeKind.New when item.Current!.Sku is null:
                tally.Unmapped++;
                break;
            case ChangeKind.New:
                jobs.Add(new PhotoJob(item.Current, item.Sha256, null));
                tally.New++;
                break;
            case ChangeKind.Gone:
                Retire(ToNode(known), graph);
                photos.Delete(item.RelativePath);
                tally.Retired++;
                break;
            case ChangeKind.Missing or ChangeKind.Unverified:
                tally.KeptMissing++;
                break;
            case ChangeKind.HashFailed when known is null:
                tally.FailedBeforeEmbedding.Add(new IngestFailure(item.RelativePath, "Unreadable", item.Error ?? "could not be read"));
                break;
            case ChangeKind.HashFailed:
                tally.KeptMissing++;
                break;
        }
    }

    private void Store(PhotoOutcome outcome, PhotoTable photos, HnswGraph graph, List<IngestFailure> failures)
    {
        Retire(outcome.Job.ReplacesNode, graph);
        var record = outcome.Record;
        if (outcome.Embedding is not null)
        {
            record = record with { NodeId = graph.Add(outcome.Embedding) };
        }
        else
        {
            failures.Add(new IngestFailure(record.Path, record.FailureReason ?? "Failed", record.FailureMessage ?? ""));
        }

        photos.Upsert(record);
    }

    private static void Retire(int? node, HnswGraph graph)
    {
        if (node is int id && id < graph.Count && !graph.IsDeleted(id))
        {
            graph.Delete(id);
        }
    }

    private static int? ToNode(KnownPhoto? known) => known?.NodeId is long id ? (int)id : null;

    private static KnownPhoto ToKnown(PhotoRecord r) => new(
        r.Path, r.Size, r.MtimeUtcTicks, r.Sha256, r.Sku, r.NodeId,
        r.Status == PhotoStatus.Indexed ? KnownPhotoStatus.Indexed : KnownPhotoStatus.Failed);

    private DateTime Now() => _clock.GetUtcNow().UtcDateTime;

    private static string Short(string fingerprint) => fingerprint.Length > 12 ? fingerprint[..12] + "…" : fingerprint;

    private static string ModelName(string cardJson)
    {
        try
        {
            return ModelCard.FromJson(cardJson, Environment.CurrentDirectory).Name;
        }
        catch (ModelLoadException)
        {
            return "unknown";
        }
    }

    private sealed class Tally
    {
        public int New;
        public int Changed;
        public int Unchanged;
        public int Moved;
        public int Updated;
        public int Retired;
        public int KeptMissing;
        public int Unmapped;
        public int Embedded;
        public readonly List<IngestFailure> FailedBeforeEmbedding = [];
    }
}

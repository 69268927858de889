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

    /// <summary>The file-system calls of the scan; tests replace them to refuse access at an exact path.</summary>
    internal ScanIo ScanIo { get; init; } = ScanIo.Default;

    /// <summary>How a worker reads a photo's bytes; tests replace it to make a file vanish or refuse access mid-run.</summary>
    internal Func<string, byte[]> ReadFile { get; init; } = File.ReadAllBytes;

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
        var scan = new CatalogueScanner(ScanOptions.Default, ScanIo).Scan(root, cancellationToken);
        var mapped = mapping.Map(scan.Entries);
        var inShard = mapped.Photos.Where(p => options.Shard?.Contains(p.Entry.RelativePath) ?? true).ToList();

        var photos = new PhotoTable(index);
        var graphStore = new GraphStore(index);
        var graph = OpenGraph(graphStore, options);
        var known = new List<KnownPhoto>();
        var withoutEvidence = new HashSet<string>(StringComparer.Ordinal);
        foreach (var record in photos.All())
        {
            known.Add(ToKnown(record));
            if (record.Status == PhotoStatus.Indexed && (record.Detail is null || record.Chroma is null))
            {
                withoutEvidence.Add(record.Path);
            }
        }

        var plan = new ChangePlanner().Plan(
            known, inShard, scan.Unreadable, new ChangePlanOptions { KeepMissing = options.KeepMissing }, cancellationToken);

        var summary = new Tally();
        var jobs = new List<PhotoJob>();
        index.InTransaction(() =>
        {
            new CatalogueSettings(root, mapping.Spec, embedder.Card.ToJson(), embedder.Fingerprint, Now()).Write(index);
            foreach (var item in plan.Items)
            {
                ApplyCheapChange(item, photos, graph, jobs, summary, options, withoutEvidence);
            }

            foreach (var problem in scan.Problems.Where(p => IsUnreadablePhoto(p, options)))
            {
                RecordUnreadable(problem.RelativePath, problem.Kind.ToString(), problem.Message, photos, summary);
            }

            graphStore.Commit(graph);
        });

        var failures = new List<IngestFailure>();
        var embeddingClock = Stopwatch.StartNew();
        var worker = new PhotoWorker(new PhotoDecoder(options.Limits), embedder, _clock, ReadFile);
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

    private void ApplyCheapChange(
        PlannedChange item, PhotoTable photos, HnswGraph graph, List<PhotoJob> jobs, Tally tally, IngestOptions options,
        HashSet<string> withoutEvidence)
    {
        var known = item.Known;
        switch (item.Kind)
        {
            // Indexed before ingest stored the detail and colour thumbnails: decode once more, keep the embedding.
            case ChangeKind.Unchanged or ChangeKind.Touched or ChangeKind.SkuChanged
                when item.Current is not null && known?.Status == KnownPhotoStatus.Indexed && withoutEvidence.Contains(item.RelativePath):
                if (item.Kind != ChangeKind.Unchanged)
                {
                    ApplyCheapChange(item, photos, graph, jobs, tally, options, []);
                }

                jobs.Add(new PhotoJob(WithPlannedSku(item), null, null, EvidenceOnly: true));
                tally.Updated += item.Kind == ChangeKind.Unchanged ? 1 : 0;
                break;
            case ChangeKind.Unchanged when options.RetryFailed && known?.Status == KnownPhotoStatus.Failed && item.Current is not null:
                jobs.Add(new PhotoJob(WithPlannedSku(item), null, null));
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
                jobs.Add(new PhotoJob(WithPlannedSku(item), item.Sha256, ToNode(known)));
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
            case ChangeKind.HashFailed:
                RecordUnreadable(item.RelativePath, "Unreadable", item.Error ?? $"{item.RelativePath} could not be read.", photos, tally);
                break;
        }
    }

    /// <summary>
    /// A file with a photo's name that the scan could not open (permission denied, I/O error) never becomes a scan
    /// entry, so the planner cannot see it; it is still a photo that failed.
    /// </summary>
    private static bool IsUnreadablePhoto(ScanProblem problem, IngestOptions options) =>
        problem.Kind is ScanProblemKind.AccessDenied or ScanProblemKind.ReadError
        && ImageSignature.HasImageExtension(problem.FullPath)
        && File.Exists(problem.FullPath)
        && (options.Shard?.Contains(problem.RelativePath) ?? true);

    /// <summary>
    /// Records a photo that could not be read. An indexed photo keeps its record and node (the last good version
    /// stays searchable) and the failure is only reported; otherwise a failed record is written with size and time
    /// zero, so the next run sees the file as changed and tries again once it can be read.
    /// </summary>
    private void RecordUnreadable(string path, string reason, string message, PhotoTable photos, Tally tally)
    {
        var known = photos.Find(path);
        if (known is { Status: PhotoStatus.Indexed })
        {
            tally.FailedBeforeEmbedding.Add(new IngestFailure(path, reason, message + " The version indexed before is kept."));
            return;
        }

        photos.Upsert(new PhotoRecord
        {
            Path = path,
            Sku = known?.Sku,
            Status = PhotoStatus.Failed,
            FailureReason = reason,
            FailureMessage = message,
            UpdatedUtc = Now(),
        });
        tally.FailedBeforeEmbedding.Add(new IngestFailure(path, reason, message));
    }

    /// <summary>The scanned entry with the SKU the plan settled on: an unmapped photo keeps the SKU it was known by.</summary>
    private static MappedEntry WithPlannedSku(PlannedChange item) => item.Current! with { Sku = item.Sku };

    private void Store(PhotoOutcome outcome, PhotoTable photos, HnswGraph graph, List<IngestFailure> failures)
    {
        if (outcome.Job.EvidenceOnly)
        {
            // Only the new evidence is taken; a photo that no longer decodes keeps its record (the sweep then judges
            // its pairs on the 32 × 32 thumbnail, as before), and the next run tries again.
            var known = photos.Find(outcome.Record.Path);
            if (known is not null && outcome.Record.Status == PhotoStatus.Indexed && outcome.Record.Sha256 == known.Sha256)
            {
                photos.Upsert(known with { Detail = outcome.Record.Detail, Chroma = outcome.Record.Chroma });
            }

            return;
        }

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

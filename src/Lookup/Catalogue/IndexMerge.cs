using System.Diagnostics;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>
/// Brings part indexes (one per shard, see <see cref="ShardSpec"/>) into one target index without embedding
/// anything again: photo records (indexed and failed) and their stored vectors are read from each part, one
/// version per relative path is chosen (<see cref="MergeRules"/>), and the target's graph is built from those vectors.
/// <list type="bullet">
/// <item>Target without a graph (new file): the graph is built in memory and written with
/// <see cref="GraphStore.Save"/> in bulk, photo records first and the graph metadata last, so a crash part-way
/// leaves a file without a graph, which the next merge rebuilds from scratch (leftover records are dropped).</item>
/// <item>Target with a graph: loaded, and only new or changed photos are inserted (a changed one retires its old
/// node), in batches that commit records and nodes together, as ingest does; a rerun after a crash finds the
/// committed batches unchanged.</item>
/// </list>
/// Every part must share the target's (or, for a new target, the first part's) <see cref="MergeBasis"/>; a part that
/// does not is refused by name before anything is written. The merge never retires a photo: a path missing from a
/// part may simply belong to another shard (see DEVELOPERS.md for how deletions reach a merged index).
/// Thread safety: one run per target (the target's writer lock enforces it); parts are opened read-only.
/// </summary>
internal sealed partial class IndexMerge(IndexFile target, TimeProvider? clock = null)
{
    private const int RecordsPerTransaction = 2_000;

    private readonly TimeProvider _clock = clock ?? TimeProvider.System;

    /// <summary>Merges <paramref name="partPaths"/> (in this order: on equal timestamps a later part wins).</summary>
    /// <exception cref="MergeRefusedException">A part is missing, is the target, was never ingested into, was built
    /// differently from the others, or is damaged; nothing was written.</exception>
    /// <exception cref="IndexFileException">A part is not an index file or cannot be opened.</exception>
    public MergeSummary Run(IReadOnlyList<string> partPaths, IProgress<MergeProgress>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(partPaths);
        ArgumentOutOfRangeException.ThrowIfZero(partPaths.Count);
        target.RequireWritable();
        var started = Stopwatch.StartNew();
        var paths = CheckPaths(partPaths);
        progress?.Report(new MergeProgress("reading", 0, paths.Count));
        var photos = new PhotoTable(target);
        bool bulk = !new GraphStore(target).HasGraph;
        var basis = bulk ? null : MergeBasis.Read(target);
        var known = bulk
            ? new Dictionary<string, PhotoRecord>(StringComparer.Ordinal)
            : photos.All().ToDictionary(r => r.Path, StringComparer.Ordinal);

        var read = ReadParts(paths, known, ref basis, progress, cancellationToken);
        var steps = read.Candidates
            .OrderBy(pair => pair.Key, StringComparer.Ordinal)
            .Select(pair => new MergeStep(MergeRules.Decide(pair.Value.Record, known.GetValueOrDefault(pair.Key)), pair.Value, known.GetValueOrDefault(pair.Key)))
            .ToList();

        var written = cancellationToken.IsCancellationRequested
            ? new WriteResult(0, TimeSpan.Zero, known, LiveNodes(known), Cancelled: true)
            : bulk
                ? WriteNew(steps, basis!, progress, cancellationToken)
                : WriteIncremental(steps, basis!, known, progress, cancellationToken);

        return new MergeSummary
        {
            Parts = paths.Count,
            RecordsRead = read.RecordsRead,
            Added = steps.Count(s => s.Kind == MergeStepKind.Add),
            Replaced = steps.Count(s => s.Kind == MergeStepKind.Replace),
            Updated = steps.Count(s => s.Kind == MergeStepKind.Update),
            Unchanged = steps.Count(s => s.Kind == MergeStepKind.Unchanged),
            Superseded = read.Superseded + steps.Count(s => s.Kind == MergeStepKind.Superseded),
            BulkBuild = bulk,
            VectorsInserted = written.VectorsInserted,
            VectorsPerSecond = written.BuildTime > TimeSpan.Zero ? written.VectorsInserted / written.BuildTime.TotalSeconds : 0,
            Elapsed = started.Elapsed,
            Cancelled = written.Cancelled,
            IndexedTotal = written.LiveNodes,
            Failures = [.. written.Records.Values
                .Where(r => r.Status == PhotoStatus.Failed)
                .OrderBy(r => r.Path, StringComparer.Ordinal)
                .Select(r => new IngestFailure(r.Path, r.FailureReason ?? "Failed", r.FailureMessage ?? ""))],
        };
    }

    private List<string> CheckPaths(IReadOnlyList<string> partPaths)
    {
        var full = new List<string>(partPaths.Count);
        foreach (string path in partPaths)
        {
            ArgumentException.ThrowIfNullOrWhiteSpace(path);
            string part = Path.GetFullPath(path);
            if (!File.Exists(part))
            {
                throw new MergeRefusedException(part, MergeProblem.Missing,
                    $"{part} does not exist: did its shard finish? Rerun that shard's ingest, or leave the file out of the merge.");
            }

            if (string.Equals(part, target.Path, StringComparison.Ordinal))
            {
                throw new MergeRefusedException(part, MergeProblem.SameFile,
                    $"{part} is the merge target itself: name the parts and give a different file to --index.");
            }

            full.Add(part);
        }

        return full;
    }

    private static PartsRead ReadParts(
        List<string> paths, Dictionary<string, PhotoRecord> known, ref MergeBasis? basis, IProgress<MergeProgress>? progress, CancellationToken cancellationToken)
    {
        var candidates = new Dictionary<string, MergeCandidate>(StringComparer.Ordinal);
        int recordsRead = 0;
        int superseded = 0;
        for (int i = 0; i < paths.Count && !cancellationToken.IsCancellationRequested; i++)
        {
            progress?.Report(new MergeProgress("reading", i, paths.Count));
            using var part = IndexFile.Open(paths[i], IndexAccess.Read);
            var partBasis = MergeBasis.Read(part);
            basis ??= partBasis;
            basis.RequireSame(partBasis);
            var graph = new GraphStore(part).Load();
            foreach (var record in new PhotoTable(part).All())
            {
                recordsRead++;
                var incoming = new MergeCandidate(record, NeedsVector(record, known.GetValueOrDefault(record.Path)) ? VectorOf(record, graph, part.Path) : null);
                if (!candidates.TryGetValue(record.Path, out var current))
                {
                    candidates.Add(record.Path, incoming);
                    continue;
                }

                superseded++;
                if (MergeRules.Supersedes(record, current.Record))
                {
                    candidates[record.Path] = incoming;
                }
            }
        }

        progress?.Report(new MergeProgress("reading", paths.Count, paths.Count));
        return new PartsRead(candidates, recordsRead, superseded);
    }

    // The vector is needed unless the target already holds these bytes embedded (then the outcome is Unchanged,
    // Update or Superseded, none of which inserts a node).
    private static bool NeedsVector(PhotoRecord record, PhotoRecord? known) =>
        record.Status == PhotoStatus.Indexed
        && !(known is not null && known.Status == PhotoStatus.Indexed && MergeRules.SameContent(record, known));

    private static float[] VectorOf(PhotoRecord record, HnswGraph graph, string partPath)
    {
        if (record.NodeId is not int id || id < 0 || id >= graph.Count || graph.IsDeleted(id))
        {
            throw new MergeRefusedException(partPath, MergeProblem.Damaged,
                $"{partPath}: photo {record.Path} points at graph node {(record.NodeId?.ToString(System.Globalization.CultureInfo.InvariantCulture) ?? "(none)")}, " +
                $"which the part's graph of {graph.Count} nodes does not hold live: the part is damaged. Delete it and rerun that shard's ingest.");
        }

        return graph.GetVector(id).ToArray();
    }

    private CatalogueSettings SettingsFrom(MergeBasis basis) => basis.Settings with { UpdatedUtc = _clock.GetUtcNow().UtcDateTime };

    private sealed record PartsRead(Dictionary<string, MergeCandidate> Candidates, int RecordsRead, int Superseded);

    private sealed record WriteResult(int VectorsInserted, TimeSpan BuildTime, IReadOnlyDictionary<string, PhotoRecord> Records, int LiveNodes, bool Cancelled);
}

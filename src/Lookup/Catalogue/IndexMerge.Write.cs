using System.Diagnostics;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>Writing the chosen records into the target: a bulk build for a new target, batches for an existing one.</summary>
internal sealed partial class IndexMerge
{
    private const int ProgressEvery = 256;

    private WriteResult WriteNew(List<MergeStep> steps, MergeBasis basis, IProgress<MergeProgress>? progress, CancellationToken cancellationToken)
    {
        int vectors = steps.Count(s => s.Winner.Vector is not null);
        var graph = new HnswGraph(basis.Dimension, basis.Parameters, initialCapacity: Math.Max(vectors, 16));
        var records = new Dictionary<string, PhotoRecord>(steps.Count, StringComparer.Ordinal);
        progress?.Report(new MergeProgress("building", 0, vectors));
        var buildClock = Stopwatch.StartNew();
        foreach (var step in steps)
        {
            if (cancellationToken.IsCancellationRequested)
            {
                // Nothing has been written yet: the target stays as it was.
                return new WriteResult(0, buildClock.Elapsed, new Dictionary<string, PhotoRecord>(), 0, Cancelled: true);
            }

            var record = step.Winner.Record;
            records.Add(record.Path, record with { NodeId = step.Winner.Vector is { } vector ? graph.Add(vector) : null });
            if (graph.Count % ProgressEvery == 0)
            {
                progress?.Report(new MergeProgress("building", graph.Count, vectors));
            }
        }

        var buildTime = buildClock.Elapsed;
        progress?.Report(new MergeProgress("building", graph.Count, vectors));

        // Records first, graph metadata last: until Save finishes the file has no graph, and a merge that finds no
        // graph starts over, dropping records an interrupted run left behind.
        progress?.Report(new MergeProgress("writing", 0, records.Count));
        var photos = new PhotoTable(target);
        var leftovers = photos.All().Select(r => r.Path).Where(path => !records.ContainsKey(path)).ToList();
        target.InTransaction(() =>
        {
            foreach (string path in leftovers)
            {
                photos.Delete(path);
            }

            SettingsFrom(basis).Write(target);
        });
        WriteRecords(photos, [.. records.Values], progress);
        new GraphStore(target).Save(graph, basis.Settings.ModelFingerprint);
        return new WriteResult(graph.Count, buildTime, records, graph.LiveCount, Cancelled: false);
    }

    private void WriteRecords(PhotoTable photos, List<PhotoRecord> records, IProgress<MergeProgress>? progress)
    {
        for (int start = 0; start < records.Count; start += RecordsPerTransaction)
        {
            int end = Math.Min(start + RecordsPerTransaction, records.Count);
            target.InTransaction(() =>
            {
                for (int i = start; i < end; i++)
                {
                    photos.Upsert(records[i]);
                }
            });
            progress?.Report(new MergeProgress("writing", end, records.Count));
        }
    }

    private WriteResult WriteIncremental(
        List<MergeStep> steps, MergeBasis basis, Dictionary<string, PhotoRecord> known, IProgress<MergeProgress>? progress, CancellationToken cancellationToken)
    {
        var store = new GraphStore(target);
        var work = steps.Where(s => s.Kind is MergeStepKind.Add or MergeStepKind.Replace or MergeStepKind.Update).ToList();
        var records = new Dictionary<string, PhotoRecord>(known, StringComparer.Ordinal);
        if (work.Count == 0)
        {
            // A repeated merge: nothing to write, not even the settings' timestamp.
            return new WriteResult(0, TimeSpan.Zero, records, LiveNodes(known), Cancelled: false);
        }

        progress?.Report(new MergeProgress("writing", 0, work.Count));
        var graph = store.Load(basis.Settings.ModelFingerprint);
        var photos = new PhotoTable(target);
        var buildClock = new Stopwatch();
        int inserted = 0;
        bool cancelled = false;
        for (int start = 0; start < work.Count; start += RecordsPerTransaction)
        {
            if (cancellationToken.IsCancellationRequested)
            {
                cancelled = true;
                break;
            }

            int end = Math.Min(start + RecordsPerTransaction, work.Count);
            target.InTransaction(() =>
            {
                if (start == 0)
                {
                    SettingsFrom(basis).Write(target);
                }

                for (int i = start; i < end; i++)
                {
                    buildClock.Start();
                    var record = Apply(work[i], graph, ref inserted);
                    buildClock.Stop();
                    photos.Upsert(record);
                    records[record.Path] = record;
                }

                store.Commit(graph);
            });
            progress?.Report(new MergeProgress("writing", end, work.Count));
        }

        return new WriteResult(inserted, buildClock.Elapsed, records, graph.LiveCount, cancelled);
    }

    private static PhotoRecord Apply(MergeStep step, HnswGraph graph, ref int inserted)
    {
        var winner = step.Winner;
        if (step.Kind == MergeStepKind.Update)
        {
            return winner.Record with { NodeId = step.Known!.NodeId };
        }

        if (step.Known?.NodeId is int old && old < graph.Count && !graph.IsDeleted(old))
        {
            graph.Delete(old);
        }

        int? node = null;
        if (winner.Vector is { } vector)
        {
            node = graph.Add(vector);
            inserted++;
        }

        return winner.Record with { NodeId = node };
    }

    private static int LiveNodes(Dictionary<string, PhotoRecord> records) => records.Values.Count(r => r.NodeId is not null);
}

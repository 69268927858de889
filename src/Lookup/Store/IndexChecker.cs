using System.Globalization;
using Lookup.Calibration;
using Lookup.Embedding;
using Lookup.Graph;

namespace Lookup.Store;

/// <summary>
/// Verifies an index file: photo records against graph nodes, the graph's own structure
/// (<see cref="HnswGraph.CheckIntegrity"/>), stored vectors, the entry point, and the model fingerprint against the
/// stored model card. <see cref="Repair(IndexFile, bool)"/> fixes what can be fixed without embedding: it rebuilds the graph from
/// the stored vectors of the photos that still own a sound one, and drops the records whose vector is lost (the next
/// ingest embeds those photos again), all in one transaction.
/// Thread safety: one call per <see cref="IndexFile"/> handle at a time; a check works on a read-only snapshot, so it
/// runs beside an ingest.
/// </summary>
public static partial class IndexChecker
{
    private const int ExamplesShown = 5;

    /// <summary>Checks <paramref name="file"/> (a reader handle will do).</summary>
    /// <param name="file">The index.</param>
    /// <param name="verifyModelFiles">Also hash the ONNX files the stored model card names and compare the fingerprint.</param>
    public static IndexCheckReport Check(IndexFile file, bool verifyModelFiles = true)
    {
        ArgumentNullException.ThrowIfNull(file);
        return Analyse(file.Path, ReadAll(file), verifyModelFiles);
    }

    /// <summary>Reads every document; a file LiteDB itself cannot read through becomes an <see cref="IndexFileException"/>.</summary>
    private static StoredIndex ReadAll(IndexFile file)
    {
        try
        {
            return StoredIndex.Read(file);
        }
        catch (Exception e) when (e is LiteDB.LiteException or IOException or InvalidCastException or IndexOutOfRangeException or ArgumentException)
        {
            throw new IndexFileException(file.Path, IndexFileProblem.NotAnIndex,
                $"{file.Path} cannot be read to the end ({e.Message}): the file itself is damaged, beyond what check --repair can mend. Restore it from a backup, or ingest the catalogue into a new index file.", e);
        }
    }

    private static IndexCheckReport Analyse(string path, StoredIndex stored, bool verifyModelFiles)
    {
        var findings = new List<CheckFinding>();
        var indexed = stored.Records.Where(r => r.Status == PhotoStatus.Indexed).ToList();
        CheckRecordsDecode(stored, findings);
        var meta = stored.Meta;
        int links = 0;
        if (meta is null)
        {
            CheckMissingGraph(stored, indexed, findings);
        }
        else
        {
            CheckNodeDocuments(stored, meta, findings);
            links = CheckGraph(stored, meta, findings);
            CheckRecordsAgainstNodes(stored, meta, indexed, findings);
        }

        CheckModel(stored, verifyModelFiles, findings);
        int live = meta is null ? 0 : Enumerable.Range(0, meta.Count).Count(id => !meta.IsDeleted(id));
        return new IndexCheckReport(
            path,
            stored.Records.Count + stored.DamagedRecords.Count,
            meta?.Count ?? 0,
            live,
            links,
            [.. findings.OrderBy(f => f.Severity)]);
    }

    private static void CheckRecordsDecode(StoredIndex stored, List<CheckFinding> findings)
    {
        if (stored.DamagedRecords.Count > 0)
        {
            findings.Add(new CheckFinding(
                "damaged-record",
                CheckSeverity.Error,
                stored.DamagedRecords.Count,
                $"{stored.DamagedRecords.Count} photo record(s) cannot be read: {Examples(stored.DamagedRecords.Select(d => $"{d.Id} ({d.Problem})"))}.",
                "check --repair removes them; the next ingest reads those photos again.",
                Repairable: true));
        }
    }

    private static void CheckMissingGraph(StoredIndex stored, List<PhotoRecord> indexed, List<CheckFinding> findings)
    {
        if (stored.MetaProblem is not null)
        {
            findings.Add(new CheckFinding(
                "damaged-graph-metadata",
                CheckSeverity.Error,
                1,
                $"The graph's metadata document cannot be used: {stored.MetaProblem}. Searches and sweeps refuse the index.",
                RebuildFix(stored),
                Repairable: CanRebuild(stored)));
        }
        else if (indexed.Count > 0)
        {
            findings.Add(new CheckFinding(
                "no-graph",
                CheckSeverity.Error,
                indexed.Count,
                $"{indexed.Count} photo record(s) say they are indexed but the file holds no graph (an interrupted merge or bulk build leaves this).",
                RebuildFix(stored),
                Repairable: CanRebuild(stored)));
        }
    }

    private static void CheckNodeDocuments(StoredIndex stored, GraphMeta meta, List<CheckFinding> findings)
    {
        var badVectors = stored.DamagedVectors.Where(v => v.Key >= 0 && v.Key < meta.Count && !meta.IsDeleted(v.Key)).ToList();
        if (badVectors.Count > 0)
        {
            findings.Add(new CheckFinding(
                "damaged-vector",
                CheckSeverity.Error,
                badVectors.Count,
                $"{badVectors.Count} live node(s) have a damaged vector: {Examples(badVectors.Select(v => $"node {v.Key} ({v.Value})"))}.",
                "check --repair leaves these nodes out of a rebuilt graph and removes their photo records; the next ingest embeds those photos again.",
                Repairable: true));
        }

        var missingVectors = LiveIds(meta).Where(id => !stored.Vectors.ContainsKey(id) && !stored.DamagedVectors.ContainsKey(id)).ToList();
        if (missingVectors.Count > 0)
        {
            findings.Add(new CheckFinding(
                "missing-vector",
                CheckSeverity.Error,
                missingVectors.Count,
                $"{missingVectors.Count} live node(s) of {meta.Count} have no stored vector: {Examples(missingVectors.Select(id => $"node {id}"))}.",
                "check --repair leaves these nodes out of a rebuilt graph and removes their photo records; the next ingest embeds those photos again.",
                Repairable: true));
        }

        var badLinks = stored.DamagedLinks.Where(l => l.Key >= 0 && l.Key < meta.Count).ToList();
        var missingLinks = Enumerable.Range(0, meta.Count).Where(id => !stored.Links.ContainsKey(id) && !stored.DamagedLinks.ContainsKey(id)).ToList();
        var outOfRange = stored.Links.Where(l => l.Key < meta.Count && l.Value.Any(layer => layer.Any(e => (uint)e >= (uint)meta.Count))).Select(l => l.Key).Order().ToList();
        if (badLinks.Count + missingLinks.Count + outOfRange.Count > 0)
        {
            var examples = badLinks.Select(l => $"node {l.Key} ({l.Value})")
                .Concat(missingLinks.Select(id => $"node {id} (no link list)"))
                .Concat(outOfRange.Select(id => $"node {id} (links outside 0..{meta.Count - 1})"));
            findings.Add(new CheckFinding(
                "damaged-links",
                CheckSeverity.Error,
                badLinks.Count + missingLinks.Count + outOfRange.Count,
                $"{badLinks.Count + missingLinks.Count + outOfRange.Count} node(s) have a missing or unreadable link list: {Examples(examples)}. Searches may miss photos or fail.",
                "check --repair rebuilds the graph from the stored vectors (nothing is embedded again).",
                Repairable: true));
        }

        int stray = stored.Vectors.Keys.Concat(stored.DamagedVectors.Keys).Concat(stored.Links.Keys).Concat(stored.DamagedLinks.Keys)
            .Where(id => id < 0 || id >= meta.Count).Distinct().Count();
        if (stray > 0)
        {
            findings.Add(new CheckFinding(
                "stray-node-documents",
                CheckSeverity.Warning,
                stray,
                $"{stray} node id(s) have vector or link documents beyond the {meta.Count} nodes the graph counts (left by an interrupted write); they take space but are never read.",
                "check --repair rebuilds the graph without them.",
                Repairable: true));
        }
    }

    /// <summary>Runs the graph's own integrity check on the nodes that decoded; returns the links it checked.</summary>
    private static int CheckGraph(StoredIndex stored, GraphMeta meta, List<CheckFinding> findings)
    {
        var graph = Restore(stored, meta);
        var report = graph.CheckIntegrity();
        int live = graph.LiveCount;
        if (live != meta.LiveCount)
        {
            findings.Add(new CheckFinding(
                "live-count",
                CheckSeverity.Error,
                1,
                $"The graph metadata counts {meta.LiveCount} live nodes; its retirement flags give {live}.",
                "check --repair rebuilds the graph and its counts from the stored vectors.",
                Repairable: true));
        }

        var entry = report.Problems.Where(p => p.StartsWith("entry point", StringComparison.Ordinal)).ToList();
        var structural = report.Problems.Where(p => !p.StartsWith("entry point", StringComparison.Ordinal)).ToList();
        if (entry.Count > 0)
        {
            findings.Add(new CheckFinding(
                "entry-point",
                CheckSeverity.Error,
                entry.Count,
                $"The search entry point is wrong: {string.Join("; ", entry)}.",
                "check --repair rebuilds the graph, which chooses the entry point again.",
                Repairable: true));
        }

        int more = report.ProblemCount - report.Problems.Count;
        if (structural.Count > 0 || more > 0)
        {
            findings.Add(new CheckFinding(
                "graph-integrity",
                CheckSeverity.Error,
                structural.Count + more,
                $"The graph fails its integrity check ({report.UnreachableLiveNodes} live node(s) unreachable): {Examples(structural)}{(more > 0 ? F($" and {more} more") : "")}.",
                "check --repair rebuilds the graph from the stored vectors (nothing is embedded again).",
                Repairable: true));
        }

        int retiredLinks = 0;
        foreach (int id in LiveIds(meta))
        {
            if (stored.Links.TryGetValue(id, out var layers))
            {
                retiredLinks += layers.Sum(layer => layer.Count(e => (uint)e < (uint)meta.Count && meta.IsDeleted(e)));
            }
        }

        if (retiredLinks > 0)
        {
            findings.Add(new CheckFinding(
                "retired-linked",
                CheckSeverity.Warning,
                retiredLinks,
                F($"Live nodes still link {retiredLinks} time(s) to retired nodes ({meta.Count - live} retired of {meta.Count}). Searches pass through retired nodes and never return them, so answers are right, but each one costs a visit."),
                "check --repair rebuilds the graph without retired nodes, when they have piled up.",
                Repairable: true));
        }

        return report.LinksChecked;
    }

    private static void CheckRecordsAgainstNodes(StoredIndex stored, GraphMeta meta, List<PhotoRecord> indexed, List<CheckFinding> findings)
    {
        var withoutNode = indexed.Where(r => r.NodeId is null).Select(r => r.Path).ToList();
        var outOfRange = indexed.Where(r => r.NodeId is int n && (n < 0 || n >= meta.Count)).Select(r => $"{r.Path} → node {r.NodeId}").ToList();
        var onRetired = indexed.Where(r => r.NodeId is int n && n >= 0 && n < meta.Count && meta.IsDeleted(n)).Select(r => $"{r.Path} → node {r.NodeId}").ToList();
        var shared = indexed.Where(r => r.NodeId is not null).GroupBy(r => r.NodeId!.Value).Where(g => g.Count() > 1)
            .Select(g => $"node {g.Key}: {string.Join(", ", g.Select(r => r.Path))}").ToList();
        const string Reembed = "check --repair removes these records (and rebuilds the graph); the next ingest embeds those photos again.";
        if (withoutNode.Count > 0)
        {
            findings.Add(new CheckFinding("record-without-node", CheckSeverity.Error, withoutNode.Count,
                $"{withoutNode.Count} indexed photo record(s) name no graph node, so searches never find them: {Examples(withoutNode)}.", Reembed, Repairable: true));
        }

        if (outOfRange.Count > 0)
        {
            findings.Add(new CheckFinding("record-node-out-of-range", CheckSeverity.Error, outOfRange.Count,
                $"{outOfRange.Count} indexed photo record(s) name a node beyond the graph's {meta.Count}: {Examples(outOfRange)}.", Reembed, Repairable: true));
        }

        if (onRetired.Count > 0)
        {
            findings.Add(new CheckFinding("record-on-retired-node", CheckSeverity.Error, onRetired.Count,
                $"{onRetired.Count} indexed photo record(s) name a retired node, so searches never find them: {Examples(onRetired)}.", Reembed, Repairable: true));
        }

        if (shared.Count > 0)
        {
            findings.Add(new CheckFinding("shared-node", CheckSeverity.Error, shared.Count,
                $"{shared.Count} node(s) are claimed by more than one photo record, so a hit cannot say which photo it is: {Examples(shared)}.", Reembed, Repairable: true));
        }

        var owned = indexed.Where(r => r.NodeId is not null).Select(r => r.NodeId!.Value).ToHashSet();
        var orphans = LiveIds(meta).Where(id => !owned.Contains(id)).ToList();
        if (orphans.Count > 0)
        {
            findings.Add(new CheckFinding("orphan-node", CheckSeverity.Error, orphans.Count,
                $"{orphans.Count} live node(s) belong to no photo record; a search that lands on one has no photo to show: {Examples(orphans.Select(id => $"node {id}"))}.",
                "check --repair rebuilds the graph without them.", Repairable: true));
        }
    }

    private static void CheckModel(StoredIndex stored, bool verifyModelFiles, List<CheckFinding> findings)
    {
        var meta = stored.Meta;
        var settings = stored.Settings;
        if (settings is null)
        {
            if (stored.SettingsProblem is not null || meta is not null)
            {
                findings.Add(new CheckFinding("no-settings", CheckSeverity.Warning, 1,
                    stored.SettingsProblem is null
                        ? "The index holds a graph but no catalogue settings (root, SKU mapping, model card)."
                        : $"The catalogue settings cannot be read: {stored.SettingsProblem}.",
                    "Run lookup ingest on the catalogue folder: it writes the settings again and embeds nothing that is unchanged.", Repairable: false));
            }

            return;
        }

        if (meta is not null && meta.ModelFingerprint != settings.ModelFingerprint)
        {
            findings.Add(new CheckFinding("model-mismatch", CheckSeverity.Error, 1,
                $"The graph was built with model {IndexModelCard.Short(meta.ModelFingerprint)} but the catalogue settings name model {IndexModelCard.Short(settings.ModelFingerprint)}; vectors of two models cannot be compared.",
                "Build a new index with one model: lookup ingest PHOTO-TREE --index NEW-FILE (--model CARD).", Repairable: false));
        }

        if (!verifyModelFiles)
        {
            return;
        }

        ModelCard card;
        try
        {
            card = IndexModelCard.Resolve(settings, null);
        }
        catch (ModelLoadException e)
        {
            findings.Add(new CheckFinding("model-card-unreadable", CheckSeverity.Warning, 1,
                $"The model card stored in the index cannot be read: {e.Message}",
                "Pass the card the index was built with to match and ingest (--model), or ingest again to store it.", Repairable: false));
            return;
        }

        string fingerprint;
        try
        {
            fingerprint = ModelFingerprint.Compute(card);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            findings.Add(new CheckFinding("model-files-missing", CheckSeverity.Warning, 1,
                $"The model files of card '{card.Name}' cannot be read ({e.Message}), so the fingerprint was not verified.",
                "Install the model files where the card says, or pass the card to match and ingest with --model.", Repairable: false));
            return;
        }

        string built = meta?.ModelFingerprint ?? settings.ModelFingerprint;
        if (fingerprint != built)
        {
            findings.Add(new CheckFinding("model-changed", CheckSeverity.Warning, 1,
                $"Model card '{card.Name}' now gives fingerprint {IndexModelCard.Short(fingerprint)}, but the index was built with {IndexModelCard.Short(built)}: the model files changed, so match and ingest with this card are refused.",
                "Restore the model files the index was built with, or ingest the catalogue into a new index with this model.", Repairable: false));
        }
    }

    /// <summary>The stored nodes as an in-memory graph for the integrity check; undecodable or out-of-range link lists are left empty.</summary>
    private static HnswGraph Restore(StoredIndex stored, GraphMeta meta)
    {
        var state = new GraphState(meta.Dimension, meta.Parameters.M, Math.Max(meta.Count, 16));
        for (int id = 0; id < meta.Count; id++)
        {
            state.Deleted[id] = meta.IsDeleted(id);
            if (stored.Vectors.TryGetValue(id, out var vector))
            {
                vector.CopyTo(state.Vectors.AsSpan(id * meta.Dimension, meta.Dimension));
            }

            if (stored.Links.TryGetValue(id, out var layers) && layers.All(layer => layer.All(e => (uint)e < (uint)meta.Count)))
            {
                NodeCodec.SetLinks(layers, state, id);
            }
        }

        var entry = meta.Entry.Id < meta.Count ? meta.Entry : EntryPoint.None;
        return HnswGraph.Restore(meta.Dimension, meta.Parameters, state, meta.Count, entry);
    }

    private static IEnumerable<int> LiveIds(GraphMeta meta) => Enumerable.Range(0, meta.Count).Where(id => !meta.IsDeleted(id));

    private static bool CanRebuild(StoredIndex stored) => stored.Dimension > 0 && (stored.Meta?.ModelFingerprint ?? stored.Settings?.ModelFingerprint) is not null;

    private static string RebuildFix(StoredIndex stored) => CanRebuild(stored)
        ? "check --repair rebuilds the graph from the stored vectors; photos whose vector is lost are embedded again by the next ingest."
        : "No vectors or model fingerprint to rebuild from: ingest the catalogue into a new index file.";

    private static string Examples(IEnumerable<string> items)
    {
        var list = items.Take(ExamplesShown + 1).ToList();
        return list.Count > ExamplesShown ? string.Join(", ", list.Take(ExamplesShown)) + ", …" : string.Join(", ", list);
    }

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

using System.Runtime.InteropServices;
using System.Text;
using LiteDB;
using Lookup.Store;

namespace Lookup.Tests.Store;

/// <summary>
/// Damages a small index on purpose, one way per test, through the store API or LiteDB directly, and checks that
/// <see cref="IndexChecker"/> names the damage and that a repair leaves a clean index whose kept photos are found
/// by their own vectors, without embedding anything.
/// </summary>
public sealed class IndexCheckerTests : IDisposable
{
    private readonly CheckedIndex index = new();

    [Fact]
    public void A_sound_index_is_clean_and_a_repair_changes_nothing()
    {
        var report = index.Check(verifyModelFiles: true);

        Assert.Empty(report.Findings);
        Assert.Equal(CheckedIndex.Photos, report.PhotoRecords);
        Assert.Equal(CheckedIndex.Photos, report.LiveNodes);
        Assert.True(report.Links > 0);
        string before = Digest(index.Path);
        var repair = index.Repair(verifyModelFiles: true);
        Assert.False(repair.GraphRebuilt);
        Assert.Empty(repair.After.Findings);
        Assert.Equal(before, Digest(index.Path));
    }

    [Fact]
    public void A_node_no_photo_owns_is_an_orphan_and_repair_leaves_it_out()
    {
        index.Change((graph, _) => graph.Add(index.Vectors[0]));

        var report = index.Check();

        var finding = Assert.Single(report.Findings);
        Assert.Equal(("orphan-node", CheckSeverity.Error, 1), (finding.Code, finding.Severity, finding.Count));
        Assert.Contains($"node {CheckedIndex.Photos}", finding.Message, StringComparison.Ordinal);
        var repair = index.Repair();
        AssertRepaired(repair, dropped: []);
        Assert.Equal(1, repair.NodesDropped);
    }

    [Fact]
    public void A_photo_whose_node_was_retired_is_named_and_repair_removes_its_record_for_the_next_ingest()
    {
        index.Change((graph, _) => graph.Delete(index.RecordOf(7).NodeId!.Value));

        var report = index.Check();

        var finding = Assert.Single(report.Findings, f => f.Severity == CheckSeverity.Error);
        Assert.Equal("record-on-retired-node", finding.Code);
        Assert.Contains(CheckedIndex.PathOf(7), finding.Message, StringComparison.Ordinal);
        AssertRepaired(index.Repair(), dropped: [CheckedIndex.PathOf(7)]);
    }

    [Fact]
    public void Retired_nodes_still_linked_from_live_ones_are_a_warning_and_repair_compacts_them_away()
    {
        index.Change((graph, table) =>
        {
            foreach (int photo in new[] { 3, 11, 19, 27 })
            {
                graph.Delete(index.RecordOf(photo).NodeId!.Value);
                table.Delete(CheckedIndex.PathOf(photo));
            }
        });

        var report = index.Check();

        var finding = Assert.Single(report.Findings);
        Assert.Equal(("retired-linked", CheckSeverity.Warning), (finding.Code, finding.Severity));
        Assert.True(report.IsHealthy);
        Assert.Equal(CheckedIndex.Photos - 4, report.LiveNodes);
        var repair = index.Repair();
        Assert.True(repair.GraphRebuilt);
        Assert.Equal(4, repair.NodesDropped);
        Assert.Empty(repair.After.Findings);
        Assert.Equal(CheckedIndex.Photos - 4, repair.After.GraphNodes);
    }

    [Fact]
    public void A_live_node_without_its_vector_is_named_and_repair_drops_the_photo_that_owned_it()
    {
        int node = index.RecordOf(12).NodeId!.Value;
        index.Raw(db => db.GetCollection("graph_vectors").Delete(node));

        var finding = Assert.Single(index.Check().Findings);

        Assert.Equal(("missing-vector", 1), (finding.Code, finding.Count));
        Assert.Contains($"node {node}", finding.Message, StringComparison.Ordinal);
        AssertRepaired(index.Repair(), dropped: [CheckedIndex.PathOf(12)]);
    }

    [Theory]
    [InlineData(8, "bytes, expected 64")]
    [InlineData(16, "length 2, expected 1")]
    [InlineData(-1, "not a finite number")]
    public void A_vector_of_the_wrong_length_or_norm_or_with_NaN_is_damaged_and_repair_drops_its_photo(int floats, string problem)
    {
        int node = index.RecordOf(20).NodeId!.Value;
        var vector = floats switch
        {
            8 => new float[8],
            16 => Enumerable.Repeat(0.5f, 16).ToArray(),
            _ => Enumerable.Repeat(float.NaN, 16).ToArray(),
        };
        index.Raw(db => db.GetCollection("graph_vectors").Upsert(new BsonDocument { ["_id"] = node, ["v"] = MemoryMarshal.AsBytes(vector.AsSpan()).ToArray() }));

        var finding = Assert.Single(index.Check().Findings);

        Assert.Equal("damaged-vector", finding.Code);
        Assert.Contains(problem, finding.Message, StringComparison.Ordinal);
        AssertRepaired(index.Repair(), dropped: [CheckedIndex.PathOf(20)]);
    }

    [Fact]
    public void A_link_list_that_is_missing_or_points_outside_the_graph_is_damaged_and_repair_rebuilds_keeping_every_photo()
    {
        index.Raw(db =>
        {
            db.GetCollection("graph_links").Delete(5);
            db.GetCollection("graph_links").Upsert(LinkDocument(9, [1, 2, 9999]));
        });

        var report = index.Check();

        var finding = Assert.Single(report.Findings, f => f.Code == "damaged-links");
        Assert.Equal(2, finding.Count);
        Assert.Contains("node 5 (no link list)", finding.Message, StringComparison.Ordinal);
        Assert.Contains("node 9 (links outside 0..59)", finding.Message, StringComparison.Ordinal);
        AssertRepaired(index.Repair(), dropped: []);
    }

    [Fact]
    public void A_self_link_fails_the_graphs_integrity_check_and_repair_rebuilds_it()
    {
        index.Raw(db => db.GetCollection("graph_links").Upsert(LinkDocument(4, [4, 1])));

        var finding = Assert.Single(index.Check().Findings, f => f.Code == "graph-integrity");

        Assert.Contains("node 4 layer 0 links to itself", finding.Message, StringComparison.Ordinal);
        AssertRepaired(index.Repair(), dropped: []);
    }

    [Fact]
    public void An_entry_point_outside_the_graph_is_named_and_repair_chooses_a_new_one()
    {
        index.Raw(db =>
        {
            var meta = db.GetCollection("graph_meta").FindById("graph");
            meta["entry"] = 5000;
            db.GetCollection("graph_meta").Upsert(meta);
        });

        var finding = Assert.Single(index.Check().Findings, f => f.Code == "entry-point");

        Assert.Contains($"while {CheckedIndex.Photos} nodes are live", finding.Message, StringComparison.Ordinal);
        AssertRepaired(index.Repair(), dropped: []);
    }

    [Fact]
    public void Two_records_claiming_one_node_are_both_removed_because_the_vector_cannot_say_whose_it_is()
    {
        index.Change((_, table) => table.Upsert(index.RecordOf(30) with { NodeId = index.RecordOf(31).NodeId }));

        var report = index.Check();

        Assert.Contains(report.Findings, f => f.Code == "shared-node");
        Assert.Contains(report.Findings, f => f.Code == "orphan-node");
        AssertRepaired(index.Repair(), dropped: [CheckedIndex.PathOf(30), CheckedIndex.PathOf(31)]);
    }

    [Fact]
    public void Records_that_cannot_be_decoded_or_name_no_node_are_removed_by_repair()
    {
        index.Raw(db =>
        {
            var photos = db.GetCollection("photos");
            var doc = photos.FindById(CheckedIndex.PathOf(40));
            doc["status"] = "Half-done";
            photos.Upsert(doc);
        });
        index.Change((_, table) => table.Upsert(index.RecordOf(41) with { NodeId = null }));

        var report = index.Check();

        Assert.Equal(["damaged-record", "orphan-node", "record-without-node"], report.Findings.Select(f => f.Code).Order());
        var repair = index.Repair();
        Assert.Equal(2, repair.RecordsDropped);
        Assert.Empty(repair.After.Findings);
        Assert.Equal(CheckedIndex.Photos - 2, repair.After.PhotoRecords);
    }

    [Fact]
    public void Records_left_without_graph_metadata_are_named_and_repair_rebuilds_the_graph_from_the_vectors()
    {
        index.Raw(db => db.GetCollection("graph_meta").DeleteAll());

        var finding = Assert.Single(index.Check().Findings);

        Assert.Equal(("no-graph", CheckedIndex.Photos, true), (finding.Code, finding.Count, finding.Repairable));
        AssertRepaired(index.Repair(), dropped: []);
    }

    [Fact]
    public void A_graph_of_another_model_than_the_settings_is_an_error_repair_cannot_mend()
    {
        index.Raw(db =>
        {
            var settings = db.GetCollection("catalogue_meta").FindById("settings");
            settings["fp"] = new string('0', 64);
            db.GetCollection("catalogue_meta").Upsert(settings);
        });

        var finding = Assert.Single(index.Check().Findings);

        Assert.Equal(("model-mismatch", false), (finding.Code, finding.Repairable));
        Assert.Contains("Build a new index with one model", finding.Fix, StringComparison.Ordinal);
        var repair = index.Repair();
        Assert.False(repair.GraphRebuilt);
        Assert.False(repair.After.IsHealthy);
    }

    [Fact]
    public void A_stored_model_card_whose_files_now_hash_differently_is_a_warning()
    {
        index.Raw(db =>
        {
            var meta = db.GetCollection("graph_meta").FindById("graph");
            meta["model"] = new string('1', 64);
            db.GetCollection("graph_meta").Upsert(meta);
            var settings = db.GetCollection("catalogue_meta").FindById("settings");
            settings["fp"] = new string('1', 64);
            db.GetCollection("catalogue_meta").Upsert(settings);
        });

        var finding = Assert.Single(index.Check(verifyModelFiles: true).Findings);

        Assert.Equal(("model-changed", CheckSeverity.Warning), (finding.Code, finding.Severity));
        Assert.Contains($"now gives fingerprint {CheckedIndex.Fingerprint[..12]}", finding.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_repair_that_fails_inside_its_transaction_leaves_the_file_exactly_as_it_was()
    {
        index.Change((graph, _) => graph.Add(index.Vectors[1]));
        string before = Digest(index.Path);

        var error = Assert.Throws<IndexFileException>(() => index.Repair(() => throw new IOException("No space left on device (injected)")));

        Assert.Equal(IndexFileProblem.WriteFailed, error.Problem);
        Assert.StartsWith($"writing {index.Path} failed: No space left on device (injected) Every transaction committed before the failure is kept", error.Message, StringComparison.Ordinal);
        Assert.Equal(before, Digest(index.Path));
        Assert.Equal("orphan-node", Assert.Single(index.Check().Findings).Code);
        AssertRepaired(index.Repair(), dropped: []);
    }

    public void Dispose() => index.Dispose();

    private static BsonDocument LinkDocument(int id, int[] layer0) => new()
    {
        ["_id"] = id,
        ["lv"] = 0,
        ["l"] = MemoryMarshal.AsBytes(new[] { layer0.Length }.Concat(layer0).ToArray().AsSpan()).ToArray(),
    };

    /// <summary>The repair left a clean file, removed exactly <paramref name="dropped"/>, and every kept photo's vector finds its own node first.</summary>
    private void AssertRepaired(IndexRepairResult repair, string[] dropped)
    {
        Assert.Empty(repair.After.Findings);
        Assert.Equal(dropped, repair.DroppedPaths);
        using var file = IndexFile.Open(index.Path, IndexAccess.Read);
        var graph = new GraphStore(file).Load();
        var records = new PhotoTable(file).All().ToList();
        Assert.Equal(CheckedIndex.Photos - dropped.Length, records.Count);
        Assert.Equal(records.Count, graph.LiveCount);
        Assert.True(graph.CheckIntegrity().IsHealthy);
        foreach (var record in records)
        {
            int photo = int.Parse(record.Path[4..7], System.Globalization.CultureInfo.InvariantCulture);
            var hit = graph.Search(index.Vectors[photo], 1).Single();
            Assert.Equal(record.NodeId, hit.Id);
        }
    }

    /// <summary>Every document of every collection, as JSON, in key order.</summary>
    private static string Digest(string path)
    {
        using var file = IndexFile.Open(path, IndexAccess.Read);
        var text = new StringBuilder();
        foreach (string name in file.Database.GetCollectionNames().Order(StringComparer.Ordinal))
        {
            text.Append(name).Append('\n');
            foreach (var doc in file.Database.GetCollection(name).FindAll())
            {
                text.Append(LiteDB.JsonSerializer.Serialize(doc)).Append('\n');
            }
        }

        return text.ToString();
    }
}

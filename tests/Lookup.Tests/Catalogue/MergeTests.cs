using Lookup.Catalogue;
using Lookup.Graph;
using Lookup.Store;
using Lookup.Tests.Store;
using static Lookup.Tests.Catalogue.MergeTestParts;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// <see cref="IndexMerge"/> on synthetic parts: 3 × 400 photos with fixed-seed vectors (1,200 in all, above the
/// exact-scan threshold, so the merged graph is really walked), a few failed photos, and parts whose node ids differ
/// from the target's.
/// </summary>
public sealed class MergeTests : IDisposable
{
    private static readonly DateTime Day2 = Day1.AddDays(1);
    private static readonly DateTime Day3 = Day1.AddDays(2);

    private readonly TempIndex dir = new();

    [Fact]
    public void Merge_into_a_new_index_holds_every_photo_of_every_part_with_its_own_vector()
    {
        var parts = ThreeParts();

        var summary = MergeInto(Target, parts);

        Assert.True(summary.BulkBuild);
        Assert.Equal(1_203, summary.Added);
        Assert.Equal(1_200, summary.VectorsInserted);
        Assert.Equal(1_200, summary.IndexedTotal);
        Assert.Equal([PathOf(5_007), PathOf(5_407), PathOf(5_807)], summary.Failures.Select(f => f.Path));
        var (records, graph) = Read(Target);
        Assert.NotNull(graph);
        Assert.True(graph.CheckIntegrity().IsHealthy, graph.CheckIntegrity().ToString());
        Assert.Equal(1_203, records.Count);
        foreach (var part in parts)
        {
            var (partRecords, partGraph) = Read(part);
            foreach (var expected in partRecords.Values)
            {
                var merged = records[expected.Path];
                Assert.True(MergeRules.SameRecord(expected, merged), expected.Path);
                if (expected.NodeId is int partNode)
                {
                    Assert.Equal(partGraph!.GetVector(partNode).ToArray(), graph.GetVector(merged.NodeId!.Value).ToArray(), new ToleranceComparer(1e-6f));
                }
            }
        }

        // Every stored vector finds its own photo first through the graph.
        var byNode = records.Values.Where(r => r.NodeId is not null).ToDictionary(r => r.NodeId!.Value, r => r.Path);
        foreach (var record in records.Values.Where(r => r.NodeId is not null))
        {
            var top = graph.Search(graph.GetVector(record.NodeId!.Value), 1);
            Assert.Equal(record.Path, byNode[top[0].Id]);
        }
    }

    [Fact]
    public void Merging_the_same_parts_again_changes_nothing()
    {
        var parts = ThreeParts();
        MergeInto(Target, parts);
        var (before, beforeGraph) = Read(Target);

        var again = MergeInto(Target, parts);

        Assert.False(again.BulkBuild);
        Assert.Equal((0, 0, 0, 1_203, 0), (again.Added, again.Replaced, again.Updated, again.Unchanged, again.VectorsInserted));
        var (after, afterGraph) = Read(Target);
        Assert.Equal(beforeGraph!.Count, afterGraph!.Count);
        Assert.Equal(before.Keys.Order(StringComparer.Ordinal), after.Keys.Order(StringComparer.Ordinal));
        Assert.All(before.Values, r => Assert.Equal(r.NodeId, after[r.Path].NodeId));
    }

    [Fact]
    public void A_part_named_twice_in_one_merge_counts_once()
    {
        string part = Write(Part(1), Photos(0, 400));

        var summary = MergeInto(Target, [part, part]);

        Assert.Equal((400, 400), (summary.Added, summary.Superseded));
        var (records, graph) = Read(Target);
        Assert.Equal(400, records.Count);
        Assert.Equal(400, graph!.Count);
    }

    [Fact]
    public void Merging_a_new_part_into_an_existing_index_inserts_only_its_photos_and_matches_a_merge_of_all()
    {
        var parts = ThreeParts();
        MergeInto(Target, [parts[0], parts[1]]);

        var summary = MergeInto(Target, [parts[2]]);

        Assert.False(summary.BulkBuild);
        Assert.Equal((401, 0, 400), (summary.Added, summary.Unchanged, summary.VectorsInserted));
        string all = Path.Combine(dir.Directory, "all.lookup");
        MergeInto(all, parts);
        var (incremental, incrementalGraph) = Read(Target);
        var (fresh, freshGraph) = Read(all);
        Assert.Equal(fresh.Keys.Order(StringComparer.Ordinal), incremental.Keys.Order(StringComparer.Ordinal));
        foreach (var record in fresh.Values)
        {
            var other = incremental[record.Path];
            Assert.True(MergeRules.SameRecord(record, other), record.Path);
            if (record.NodeId is int node)
            {
                Assert.Equal(freshGraph!.GetVector(node).ToArray(), incrementalGraph!.GetVector(other.NodeId!.Value).ToArray(), new ToleranceComparer(1e-6f));
            }
        }

        Assert.True(incrementalGraph!.CheckIntegrity().IsHealthy);
    }

    [Fact]
    public void A_photo_whose_content_changed_in_a_newer_part_replaces_its_old_node()
    {
        MergeInto(Target, [Write(Part(1), Photos(0, 400))]);
        var (before, _) = Read(Target);
        int oldNode = before[PathOf(5)].NodeId!.Value;
        string newer = Write(Part(2), [Photo(5, Day2, contentVersion: 1), Photo(6, Day1)]);

        var summary = MergeInto(Target, [newer]);

        Assert.Equal((1, 1, 1), (summary.Replaced, summary.Unchanged, summary.VectorsInserted));
        var (after, graph) = Read(Target);
        var changed = after[PathOf(5)];
        Assert.Equal(Sha(5, 1), changed.Sha256);
        Assert.True(graph!.IsDeleted(oldNode));
        Assert.Equal(Vector(5, 1), graph.GetVector(changed.NodeId!.Value).ToArray(), new ToleranceComparer(1e-6f));
        Assert.Equal(400, graph.LiveCount);
        Assert.Equal(400, summary.IndexedTotal);
    }

    [Fact]
    public void An_older_part_does_not_undo_a_newer_change_whatever_the_order()
    {
        string old = Write(Part(1), Photos(0, 10));
        string newer = Write(Part(2), [Photo(5, Day2, contentVersion: 1)]);

        var inOneRun = MergeInto(Target, [newer, old]);
        var later = MergeInto(Path.Combine(dir.Directory, "two-runs.lookup"), [newer]);
        var undo = MergeInto(Path.Combine(dir.Directory, "two-runs.lookup"), [old]);

        Assert.Equal(1, inOneRun.Superseded);
        Assert.Equal(Sha(5, 1), Read(Target).Records[PathOf(5)].Sha256);
        Assert.Equal(1, later.Added);
        Assert.Equal((9, 0, 1), (undo.Added, undo.Replaced, undo.Superseded));
        Assert.Equal(Sha(5, 1), Read(Path.Combine(dir.Directory, "two-runs.lookup")).Records[PathOf(5)].Sha256);
    }

    [Fact]
    public void The_same_bytes_embedded_beat_a_newer_failed_try()
    {
        string failed = Write(Part(1), [Failed(3, Day2)]);
        string indexed = Write(Part(2), [Photo(3, Day1)]);

        var summary = MergeInto(Target, [indexed, failed]);

        Assert.Empty(summary.Failures);
        var (records, graph) = Read(Target);
        Assert.Equal(PhotoStatus.Indexed, records[PathOf(3)].Status);
        Assert.Equal(1, graph!.LiveCount);
    }

    [Fact]
    public void A_newer_failure_of_other_bytes_retires_the_old_embedding_as_ingest_would()
    {
        MergeInto(Target, [Write(Part(1), Photos(0, 3))]);
        string broken = Write(Part(2), [Failed(1, Day2, contentVersion: 1)]);

        var summary = MergeInto(Target, [broken]);

        Assert.Equal(1, summary.Replaced);
        Assert.Equal([PathOf(1)], summary.Failures.Select(f => f.Path));
        var (records, graph) = Read(Target);
        Assert.Equal(PhotoStatus.Failed, records[PathOf(1)].Status);
        Assert.Null(records[PathOf(1)].NodeId);
        Assert.Equal(2, graph!.LiveCount);
    }

    [Fact]
    public void A_target_left_without_a_graph_by_an_interrupted_merge_is_rebuilt_and_its_stray_records_dropped()
    {
        string part = Write(Part(1), Photos(0, 50));
        using (var file = IndexFile.Open(Target, IndexAccess.Write))
        {
            var table = new PhotoTable(file);
            file.InTransaction(() =>
            {
                table.Upsert(Photo(0, Day1).Record with { NodeId = 17 });
                table.Upsert(Photo(999, Day1).Record with { Path = "stray/left-over.jpg", NodeId = 3 });
            });
        }

        var summary = MergeInto(Target, [part]);

        Assert.True(summary.BulkBuild);
        var (records, graph) = Read(Target);
        Assert.Equal(50, records.Count);
        Assert.DoesNotContain("stray/left-over.jpg", records.Keys);
        Assert.Equal(Vector(0), graph!.GetVector(records[PathOf(0)].NodeId!.Value).ToArray(), new ToleranceComparer(1e-6f));
    }

    // The refusal reason as its name: MergeProblem is internal and test parameters must be public types.
    public static TheoryData<string, string> Differences => new()
    {
        { "model", nameof(MergeProblem.ModelMismatch) },
        { "root", nameof(MergeProblem.RootMismatch) },
        { "sku", nameof(MergeProblem.SkuMappingMismatch) },
        { "graph", nameof(MergeProblem.GraphMismatch) },
        { "dimension", nameof(MergeProblem.GraphMismatch) },
    };

    [Theory]
    [MemberData(nameof(Differences))]
    public void A_part_built_differently_is_refused_by_name_and_nothing_is_written(string difference, string problem)
    {
        string good = Write(Part(1), Photos(0, 20));
        var basis = Differ(difference);
        string odd = Write(Part(2), Photos(20, 20), basis);

        var error = Assert.Throws<MergeRefusedException>(() => MergeInto(Target, [good, odd]));

        Assert.Equal(Enum.Parse<MergeProblem>(problem), error.Problem);
        Assert.Equal(odd, error.PartPath);
        Assert.Contains(odd, error.Message, StringComparison.Ordinal);
        Assert.Contains(good, error.Message, StringComparison.Ordinal);
        var (records, graph) = Read(Target);
        Assert.Empty(records);
        Assert.Null(graph);
    }

    [Theory]
    [MemberData(nameof(Differences))]
    public void A_part_built_differently_from_the_existing_target_is_refused_and_the_target_kept(string difference, string problem)
    {
        MergeInto(Target, [Write(Part(1), Photos(0, 20))]);
        string odd = Write(Part(2), Photos(20, 20), Differ(difference));

        var error = Assert.Throws<MergeRefusedException>(() => MergeInto(Target, [odd]));

        Assert.Equal(Enum.Parse<MergeProblem>(problem), error.Problem);
        Assert.Contains(odd, error.Message, StringComparison.Ordinal);
        Assert.Contains(Target, error.Message, StringComparison.Ordinal);
        Assert.Equal(20, Read(Target).Records.Count);
    }

    [Fact]
    public void The_model_mismatch_message_names_both_fingerprints_and_the_fix()
    {
        string good = Write(Part(1), Photos(0, 2));
        string odd = Write(Part(2), Photos(2, 2), new PartBasis { Fingerprint = "0123456789abcdef0123" });

        var error = Assert.Throws<MergeRefusedException>(() => MergeInto(Target, [good, odd]));

        Assert.Contains("fingerprint 0123456789ab…", error.Message, StringComparison.Ordinal);
        Assert.Contains("fingerprint fp-synthetic…", error.Message, StringComparison.Ordinal);
        Assert.Contains("--model", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_part_the_target_itself_and_a_part_never_ingested_into_are_refused_by_name()
    {
        string good = Write(Part(1), Photos(0, 2));
        string missing = Part(7);
        string empty = Part(8);
        IndexFile.Open(empty, IndexAccess.Write).Dispose();

        var notThere = Assert.Throws<MergeRefusedException>(() => MergeInto(Target, [good, missing]));
        var never = Assert.Throws<MergeRefusedException>(() => MergeInto(Target, [good, empty]));
        MergeInto(Target, [good]);
        var itself = Assert.Throws<MergeRefusedException>(() => MergeInto(Target, [Target]));

        Assert.Equal((MergeProblem.Missing, missing), (notThere.Problem, notThere.PartPath));
        Assert.Equal((MergeProblem.NotIngested, empty), (never.Problem, never.PartPath));
        Assert.Equal(MergeProblem.SameFile, itself.Problem);
        Assert.Contains("shard", notThere.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_record_pointing_at_a_retired_node_is_refused_naming_the_part_and_the_photo()
    {
        string part = Write(Part(1), Photos(0, 5), retiredFirst: 2);
        using (var file = IndexFile.Open(part, IndexAccess.Write))
        {
            var table = new PhotoTable(file);
            file.InTransaction(() => table.Upsert(table.Find(PathOf(3))! with { NodeId = 0 }));
        }

        var error = Assert.Throws<MergeRefusedException>(() => MergeInto(Target, [part]));

        Assert.Equal(MergeProblem.Damaged, error.Problem);
        Assert.Contains(part, error.Message, StringComparison.Ordinal);
        Assert.Contains(PathOf(3), error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Cancelling_before_the_build_writes_nothing()
    {
        string part = Write(Part(1), Photos(0, 50));
        using var cancel = new CancellationTokenSource();
        cancel.Cancel();

        MergeSummary summary;
        using (var file = IndexFile.Open(Target, IndexAccess.Write))
        {
            summary = new IndexMerge(file).Run([part], null, cancel.Token);
        }

        Assert.True(summary.Cancelled);
        var (records, graph) = Read(Target);
        Assert.Empty(records);
        Assert.Null(graph);
    }

    public void Dispose() => dir.Dispose();

    private string Target => dir.Path;

    private string Part(int k) => Path.Combine(dir.Directory, $"part-{k}.lookup");

    private List<string> ThreeParts() =>
    [
        Write(Part(1), [.. Photos(0, 400), Failed(5_007, Day1)], retiredFirst: 3),
        Write(Part(2), [.. Photos(400, 400), Failed(5_407, Day1)]),
        Write(Part(3), [.. Photos(800, 400), Failed(5_807, Day1)], retiredFirst: 11),
    ];

    private static MergeSummary MergeInto(string target, IReadOnlyList<string> parts)
    {
        using var file = IndexFile.Open(target, IndexAccess.Write);
        return new IndexMerge(file, new FixedClock(Day3)).Run(parts);
    }

    private static PartBasis Differ(string difference) => difference switch
    {
        "model" => new PartBasis { Fingerprint = "fp-another-model" },
        "root" => new PartBasis { Root = "/mnt/other-catalogue" },
        "sku" => new PartBasis { SkuMapping = "pattern:^(?<sku>[^/]+)/" },
        "graph" => new PartBasis { Graph = new HnswParameters(M: 8) },
        _ => new PartBasis { Dimension = 2 * Dimension },
    };

    private sealed class FixedClock(DateTime now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => new(now);
    }

    private sealed class ToleranceComparer(float tolerance) : IEqualityComparer<float>
    {
        public bool Equals(float x, float y) => Math.Abs(x - y) <= tolerance;

        public int GetHashCode(float obj) => 0;
    }
}

using Lookup.Store;
using Lookup.Sweeps;
using Lookup.Tests.Store;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// <see cref="IndexSweep"/> on a real index file holding the synthetic catalogue (<see cref="SyntheticCatalogue"/>,
/// known answers), its graph always walked (never the exact scan), against the engine run directly on the photos.
/// </summary>
public sealed class IndexSweepTests : IDisposable
{
    private readonly TempIndex _index = new();
    private readonly List<SweepPhoto> _photos = SyntheticCatalogue.Build();

    public IndexSweepTests() => SyntheticIndex.Add(_index.Path, _photos);

    [Fact]
    public void Run_finds_over_the_index_what_the_engine_finds_over_the_same_photos()
    {
        var expected = SweepEngine.Run(_photos, new ExactNeighbourSource(_photos));

        var result = IndexSweep.Run(_index.Path, new IndexSweepOptions { Store = false });

        Assert.Equal(expected.Findings.Select(f => (f.Kind, f.Key)), result.Report.Findings.Select(f => (f.Kind, f.Key)));
        Assert.Equal(expected.Counts, result.Report.Counts);
        Assert.Equal("/catalogue", result.CatalogueRoot);
        Assert.Equal(result.Report.Findings.Select(f => f.Key).ToHashSet(), result.NewKeys);
        Assert.Equal((false, "storing was not asked for"), (result.Stored, result.NotStoredReason));
    }

    [Fact]
    public void Run_stores_each_sweep_and_the_next_one_compares_with_it()
    {
        var first = IndexSweep.Run(_index.Path);
        var second = IndexSweep.Run(_index.Path, new IndexSweepOptions { NewOnly = true });

        Assert.Equal((1, (int?)null), (first.Number, first.Previous?.Number));
        Assert.Equal((2, (int?)1), (second.Number, second.Previous?.Number));
        Assert.Empty(second.Report.Findings);
        Assert.Empty(second.NewKeys);
        Assert.Equal(first.Report.Findings.Count, second.Report.Counts.AlreadyReported);
        using var file = IndexFile.Open(_index.Path, IndexAccess.Read);
        var sweeps = new SweepStore(file);
        var stored = sweeps.Latest()!;
        Assert.Equal((2, _photos.Count, first.Report.Findings.Count, 0), (stored.Number, stored.Photos, stored.Findings, stored.NewFindings));
        Assert.Equal(first.Report.Findings.Select(f => f.Key), sweeps.FindingsOf(2).Select(f => f.Key));
    }

    [Fact]
    public void Run_with_new_only_reports_only_the_finding_a_new_photo_made()
    {
        IndexSweep.Run(_index.Path);
        // A byte copy of e1 under SKU I turns "copies inside E" {e1, e2} into "same photo under E and I" {e1, e2, i1}.
        var e1 = _photos.Single(p => p.Path == "E/e1.png");
        SyntheticIndex.Add(_index.Path, [e1 with { Id = 999, Sku = "I", Path = "I/i1.png" }]);

        var result = IndexSweep.Run(_index.Path, new IndexSweepOptions { NewOnly = true });

        var finding = Assert.Single(result.Report.Findings);
        Assert.Equal(["E/e1.png", "E/e2.png", "I/i1.png"], SyntheticCatalogue.Paths(finding));
        Assert.Equal(FindingKind.SamePhotoSeveralSkus, finding.Kind);
        Assert.Equal(1, result.NewFindings(Enum.GetValues<FindingKind>().ToHashSet()));
        Assert.Equal(0, result.NewFindings(new HashSet<FindingKind> { FindingKind.CopiesInOneSku }));
    }

    [Fact]
    public void Run_applies_reviewers_decisions_stored_in_the_index()
    {
        var before = IndexSweep.Run(_index.Path, new IndexSweepOptions { Store = false });
        var lookAlike = before.Report.Findings.Single(f => f.Kind == FindingKind.LookAlikesAcrossSkus && f.Skus.Contains("D"));
        using (var file = IndexFile.Open(_index.Path, IndexAccess.Write))
        {
            file.InTransaction(() => new DecisionStore(file).TryAdd(new ReviewerDecision(
                lookAlike.Pairs[0].Key, DecisionTarget.Pair, "ana", DateTime.UnixEpoch, "", [], null, "test")));
        }

        var after = IndexSweep.Run(_index.Path, new IndexSweepOptions { Store = false });

        Assert.DoesNotContain(after.Report.Findings, f => f.Key == lookAlike.Key);
        Assert.Equal(before.Report.Findings.Count - 1, after.Report.Findings.Count);
        Assert.Equal(1, after.Report.Counts.SuppressedByDecisions);
    }

    [Fact]
    public void Run_leaves_out_and_counts_photos_without_a_sku_or_a_live_node()
    {
        using (var file = IndexFile.Open(_index.Path, IndexAccess.Write))
        {
            var store = new GraphStore(file);
            var graph = store.Load();
            var table = new PhotoTable(file);
            var retired = table.Find("H/h2.png")!;
            file.InTransaction(() =>
            {
                graph.Delete(retired.NodeId!.Value);
                table.Upsert(table.Find("G/g2.png")! with { Sku = null });
                table.Upsert(table.Find("A/a3.png")! with { Path = "A/a3 again.png" });
                table.Upsert(new PhotoRecord { Path = "X/broken.jpg", Status = PhotoStatus.Failed, UpdatedUtc = DateTime.UnixEpoch });
                store.Commit(graph);
            });
        }

        var result = IndexSweep.Run(_index.Path, new IndexSweepOptions { Store = false });

        Assert.Equal(_photos.Count - 2, result.Report.Counts.Photos);
        Assert.Equal((1, 2), (result.PhotosWithoutSku, result.PhotosWithoutNode));
    }

    [Fact]
    public void Run_while_another_writer_holds_the_index_reports_and_says_it_was_not_stored()
    {
        IndexSweepResult result;
        using (IndexFile.Open(_index.Path, IndexAccess.Write))
        {
            result = IndexSweep.Run(_index.Path);
        }

        Assert.False(result.Stored);
        Assert.Contains($"is being written by pid {Environment.ProcessId}", result.NotStoredReason, StringComparison.Ordinal);
        Assert.Contains("reported but not stored", result.NotStoredReason, StringComparison.Ordinal);
        Assert.NotEmpty(result.Report.Findings);
        using var file = IndexFile.Open(_index.Path, IndexAccess.Read);
        Assert.Null(new SweepStore(file).Latest());
    }

    [Fact]
    public async Task Run_waits_up_to_the_store_wait_for_the_writer_and_then_stores()
    {
        var writer = IndexFile.Open(_index.Path, IndexAccess.Write);
        var release = Task.Run(async () =>
        {
            await Task.Delay(TimeSpan.FromMilliseconds(300));
            writer.Dispose();
        });

        var result = IndexSweep.Run(_index.Path, new IndexSweepOptions { StoreWait = TimeSpan.FromMinutes(2) });
        await release;

        Assert.Equal(1, result.Number);
        Assert.Null(result.NotStoredReason);
    }

    [Fact]
    public void EffectiveOptions_take_the_copy_band_from_the_index_and_cap_the_crop_search_at_it()
    {
        using (var file = IndexFile.Open(_index.Path, IndexAccess.Write))
        {
            Assert.Equal(new SweepOptions(), IndexSweep.EffectiveOptions(file));
            file.InTransaction(() => (VerdictThresholds.Default with { Copy = 0.12f, Source = "calibrated" }).Write(file));
            var options = IndexSweep.EffectiveOptions(file);

            Assert.Equal((0.12f, 0.12f, 0.10f), (options.CopyMaxDistance, options.CropMaxDistance, options.LookAlikeMaxDistance));
            options.Validate();
        }
    }

    [Fact]
    public void Run_of_an_index_without_a_graph_names_the_file_and_the_fix()
    {
        using var empty = new TempIndex();
        using (IndexFile.Open(empty.Path, IndexAccess.Write))
        {
        }

        var error = Assert.Throws<IndexFileException>(() => IndexSweep.Run(empty.Path));

        Assert.Equal(IndexFileProblem.NoGraph, error.Problem);
        Assert.Contains(empty.Path, error.Message, StringComparison.Ordinal);
        Assert.Contains("run ingest", error.Message, StringComparison.Ordinal);
    }

    public void Dispose() => _index.Dispose();
}

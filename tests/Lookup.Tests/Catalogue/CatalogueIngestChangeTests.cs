using Lookup.Store;
using Lookup.Tests.Embedding;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// Change detection from one ingest run to the next, checked through search: each photo's content is embedded
/// afresh by the test (the shared reference embedder) and looked up in the index's graph, and the record that
/// owns the nearest node must be the photo at its current path, under its current SKU.
/// Photos: open reference photos (tests/reference-data, see SOURCES.md).
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class CatalogueIngestChangeTests(EmbedderFixture fixture) : IDisposable
{
    // The ingest embeds exactly as the fixture does (same decoder and model); float rounding only.
    private const float Same = 1e-4f;

    private static readonly DateTime Later = TempTree.FixedTime.AddDays(3);

    private static readonly (string Path, string Reference)[] Photos =
    [
        ("BR-1/a.jpg", "opencv/apple.jpg"),
        ("BR-1/b.jpg", "opencv/baboon.jpg"),
        ("BR-2/c.jpg", "opencv/fruits.jpg"),
        ("BR-2/d.png", "opencv/smarties.png"),
    ];

    private readonly IngestTree tree = new();

    [Fact]
    public void A_second_run_over_an_unchanged_tree_embeds_nothing_and_leaves_records_and_nodes_as_they_were()
    {
        Fill();
        var first = EngineIngest.Run(tree, fixture.Embedder);
        var before = IndexSnapshot.Read(tree.IndexPath);

        var second = EngineIngest.Run(tree, fixture.Embedder);
        var after = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal((4, 4), (first.New, first.Embedded));
        Assert.Equal((0, 0, 4, 0, 0), (second.New, second.Embedded, second.Unchanged, second.Changed, second.Failures.Count));
        Assert.Equal(before.Digest(), after.Digest());
        foreach (var (path, reference) in Photos)
        {
            AssertFound(after, reference, path, path.Split('/')[0]);
        }
    }

    [Fact]
    public void Records_from_before_the_detail_and_colour_thumbnails_get_them_on_the_next_run_without_embedding_again()
    {
        Fill();
        EngineIngest.Run(tree, fixture.Embedder);
        var fresh = IndexSnapshot.Read(tree.IndexPath);
        using (var file = IndexFile.Open(tree.IndexPath, IndexAccess.Write))
        {
            var table = new PhotoTable(file);
            file.InTransaction(() =>
            {
                foreach (var record in table.All().ToList())
                {
                    table.Upsert(record with { Detail = null, Chroma = null });
                }
            });
        }

        var summary = EngineIngest.Run(tree, fixture.Embedder);
        var after = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal((0, 0, 4, 0, 0), (summary.New, summary.Embedded, summary.Updated, summary.Changed, summary.Failures.Count));
        Assert.Equal(fresh.Digest(), after.Digest());
        Assert.All(after.Indexed, r => Assert.Equal((4096, 2048), (r.Detail!.Length, r.Chroma!.Length)));
        var third = EngineIngest.Run(tree, fixture.Embedder);
        Assert.Equal((0, 0, 4), (third.Updated, third.Embedded, third.Unchanged));
    }

    [Fact]
    public void A_changed_photo_is_embedded_again_and_its_old_node_is_never_returned()
    {
        Fill();
        EngineIngest.Run(tree, fixture.Embedder);
        int oldNode = IndexSnapshot.Read(tree.IndexPath).Records["BR-1/a.jpg"].NodeId!.Value;

        tree.Add("BR-1/a.jpg", "opencv/board.jpg", Later);
        var summary = EngineIngest.Run(tree, fixture.Embedder);
        var index = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal((1, 1, 3), (summary.Changed, summary.Embedded, summary.Unchanged));
        var record = AssertFound(index, "opencv/board.jpg", "BR-1/a.jpg", "BR-1");
        Assert.NotEqual(oldNode, record.NodeId);
        Assert.True(index.Graph!.IsDeleted(oldNode));
        Assert.Null(index.ByNode(oldNode));
        var hits = index.SearchAll(Embed("opencv/apple.jpg"));
        Assert.Equal(4, hits.Length);
        Assert.DoesNotContain(hits, h => h.Id == oldNode);
        Assert.All(hits, h => Assert.NotNull(index.ByNode(h.Id)));
        Assert.True(hits[0].Distance > 0.05f, $"the old content is still found at distance {hits[0].Distance}");
    }

    [Fact]
    public void A_moved_photo_keeps_its_node_and_search_returns_the_new_path_and_sku_without_embedding_again()
    {
        Fill();
        EngineIngest.Run(tree, fixture.Embedder);
        int node = IndexSnapshot.Read(tree.IndexPath).Records["BR-1/a.jpg"].NodeId!.Value;

        Directory.CreateDirectory(tree.PathOf("BR-9"));
        File.Move(tree.PathOf("BR-1/a.jpg"), tree.PathOf("BR-9/renamed.jpg"));
        var summary = EngineIngest.Run(tree, fixture.Embedder);
        var index = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal((1, 0, 0, 0), (summary.Moved, summary.Embedded, summary.New, summary.Retired));
        Assert.False(index.Records.ContainsKey("BR-1/a.jpg"));
        var record = AssertFound(index, "opencv/apple.jpg", "BR-9/renamed.jpg", "BR-9");
        Assert.Equal(node, record.NodeId);
        Assert.Equal(4, index.Graph!.LiveCount);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void A_deleted_photo_is_retired_unless_missing_photos_are_kept(bool keepMissing)
    {
        Fill();
        EngineIngest.Run(tree, fixture.Embedder);
        int node = IndexSnapshot.Read(tree.IndexPath).Records["BR-2/c.jpg"].NodeId!.Value;

        File.Delete(tree.PathOf("BR-2/c.jpg"));
        var summary = EngineIngest.Run(tree, fixture.Embedder, EngineIngest.Options(tree) with { KeepMissing = keepMissing });
        var index = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal(0, summary.Embedded);
        if (keepMissing)
        {
            Assert.Equal((0, 1), (summary.Retired, summary.KeptMissing));
            Assert.Equal(node, AssertFound(index, "opencv/fruits.jpg", "BR-2/c.jpg", "BR-2").NodeId);
        }
        else
        {
            Assert.Equal((1, 0), (summary.Retired, summary.KeptMissing));
            Assert.False(index.Records.ContainsKey("BR-2/c.jpg"));
            Assert.True(index.Graph!.IsDeleted(node));
            Assert.DoesNotContain(index.SearchAll(Embed("opencv/fruits.jpg")), h => h.Id == node);
        }
    }

    [Fact]
    public void An_added_photo_is_embedded_and_found_under_its_folder()
    {
        Fill();
        EngineIngest.Run(tree, fixture.Embedder);

        tree.Add("BR-3/new.jpg", "opencv/building.jpg");
        var summary = EngineIngest.Run(tree, fixture.Embedder);
        var index = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal((1, 1, 4), (summary.New, summary.Embedded, summary.Unchanged));
        AssertFound(index, "opencv/building.jpg", "BR-3/new.jpg", "BR-3");
        Assert.Equal(5, index.Graph!.LiveCount);
    }

    [Fact]
    public void A_changed_photo_the_mapping_no_longer_names_keeps_the_sku_it_was_known_by()
    {
        Fill();
        var csv = tree.Outside("skus.csv");
        File.WriteAllText(csv, $"file,sku\n{tree.PathOf("BR-1/a.jpg")},P-100\n{tree.PathOf("BR-1/b.jpg")},P-200\n");
        var options = EngineIngest.Options(tree) with { SkuMapping = "csv:" + csv };
        EngineIngest.Run(tree, fixture.Embedder, options);

        File.WriteAllText(csv, $"file,sku\n{tree.PathOf("BR-1/b.jpg")},P-200\n");
        tree.Add("BR-1/a.jpg", "opencv/board.jpg", Later);
        var summary = EngineIngest.Run(tree, fixture.Embedder, options);

        Assert.Equal((1, 1), (summary.Changed, summary.Embedded));
        AssertFound(IndexSnapshot.Read(tree.IndexPath), "opencv/board.jpg", "BR-1/a.jpg", "P-100");
    }

    public void Dispose() => tree.Dispose();

    private void Fill()
    {
        foreach (var (path, reference) in Photos)
        {
            tree.Add(path, reference);
        }
    }

    private float[] Embed(string reference) => fixture.EmbedBytes(IngestTree.Bytes(reference), reference);

    /// <summary>The nearest node to the reference photo's embedding belongs to the record at <paramref name="path"/>.</summary>
    private PhotoRecord AssertFound(IndexSnapshot index, string reference, string path, string sku)
    {
        var (record, hit) = index.Nearest(Embed(reference));
        Assert.NotNull(record);
        Assert.Equal((path, sku, PhotoStatus.Indexed), (record.Path, record.Sku, record.Status));
        Assert.True(hit.Distance < Same, $"{reference} found {record.Path} at distance {hit.Distance}");
        return record;
    }
}

using Lookup.Catalogue;
using Lookup.Graph;
using Lookup.Store;
using Lookup.Tests.Embedding;
using Lookup.Tests.Imaging;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// <c>ingest --shard K/N</c> with the real ResNet18 embedder on a small catalogue of open photos (opencv-doc and
/// scikit-image samples in tests/reference-data, one SKU folder per photo) plus two broken files: shards partition
/// the photos, reruns and stopped runs are per shard, and merged shards equal one ingest of the whole tree.
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class ShardIngestTests(EmbedderFixture fixture) : IDisposable
{
    private const int Shards = 3;

    private static readonly string[] Photos =
    [
        "opencv/apple.jpg", "opencv/baboon.jpg", "opencv/fruits.jpg", "opencv/building.jpg", "opencv/messi5.jpg",
        "opencv/smarties.png", "opencv/box.png", "opencv/graf1.png", "skimage/astronaut.png", "skimage/coffee.png",
        "skimage/chelsea.png", "skimage/rocket.jpg",
    ];

    private readonly TempTree tree = new();
    private readonly TempTree indexes = new();

    [Fact]
    public void Shards_partition_the_photos_and_their_merge_equals_one_ingest_of_the_whole_tree()
    {
        string root = BuildCatalogue(tree, Photos);
        string single = indexes.PathOf("single.lookup");
        var whole = Ingest(root, single, shard: null, workers: 2);

        var parts = new List<string>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (int k = 1; k <= Shards; k++)
        {
            string part = indexes.PathOf($"part-{k}.lookup");
            var summary = Ingest(root, part, new ShardSpec(k, Shards));
            var records = MergeTestParts.Read(part).Records.Values.ToList();

            Assert.All(records, r => Assert.Equal(k, ShardSpec.Of(r.Path, Shards)));
            Assert.All(records, r => Assert.True(seen.Add(r.Path), $"{r.Path} is in two shards"));
            Assert.Equal(whole.Scanned - records.Count, summary.OtherShards);
            Assert.Equal(
                records.Where(r => r.Status == PhotoStatus.Failed).Select(r => r.Path).Order(StringComparer.Ordinal),
                summary.Failures.Select(f => f.Path).Order(StringComparer.Ordinal));
            parts.Add(part);
        }

        var (wholeRecords, wholeGraph) = MergeTestParts.Read(single);
        Assert.Equal(wholeRecords.Keys.Order(StringComparer.Ordinal), seen.Order(StringComparer.Ordinal));
        Assert.Equal(2, whole.Failed);

        string merged = indexes.PathOf("merged.lookup");
        using (var file = IndexFile.Open(merged, IndexAccess.Write))
        {
            new IndexMerge(file).Run(parts);
        }

        var (mergedRecords, mergedGraph) = MergeTestParts.Read(merged);
        AssertSameCatalogue(wholeRecords, wholeGraph!, mergedRecords, mergedGraph!);
    }

    [Fact]
    public void A_shard_holds_the_same_photos_whatever_order_the_tree_was_written_in_and_a_rerun_does_nothing()
    {
        string forward = BuildCatalogue(tree, Photos);
        using var other = new TempTree();
        string backward = BuildCatalogue(other, [.. Photos.Reverse()]);
        var shard = new ShardSpec(2, Shards);

        var first = Ingest(forward, indexes.PathOf("forward.lookup"), shard);
        var second = Ingest(backward, indexes.PathOf("backward.lookup"), shard);
        var rerun = Ingest(forward, indexes.PathOf("forward.lookup"), shard);

        Assert.Equal(
            MergeTestParts.Read(indexes.PathOf("forward.lookup")).Records.Keys.Order(StringComparer.Ordinal),
            MergeTestParts.Read(indexes.PathOf("backward.lookup")).Records.Keys.Order(StringComparer.Ordinal));
        Assert.Equal(first.New, second.New);
        Assert.True(first.New > 0);
        Assert.Equal((0, 0, first.New), (rerun.New, rerun.Embedded, rerun.Unchanged));
    }

    [Fact]
    public void A_stopped_shard_finishes_on_rerun_without_duplicates_and_without_touching_other_shards()
    {
        string root = BuildCatalogue(tree, Photos);
        var shard = ShardWithMostPhotos(root);
        string part = indexes.PathOf("part.lookup");
        using var stop = new CancellationTokenSource();

        var stopped = Ingest(root, part, shard, batchSize: 1, cancel: stop, stopAfter: 1);
        int committed = MergeTestParts.Read(part).Records.Count;
        var finished = Ingest(root, part, shard);

        Assert.True(stopped.Cancelled);
        Assert.InRange(committed, 1, stopped.New - 1);
        Assert.Equal(stopped.New - committed, finished.New);
        var (records, graph) = MergeTestParts.Read(part);
        Assert.All(records.Keys, path => Assert.Equal(shard.Index, ShardSpec.Of(path, Shards)));
        Assert.Equal(stopped.New, records.Count);
        Assert.Equal(records.Values.Count(r => r.Status == PhotoStatus.Indexed), graph!.LiveCount);
        Assert.Equal(graph.LiveCount, records.Values.Select(r => r.NodeId).OfType<int>().Distinct().Count());
    }

    [Fact]
    public void A_photo_removed_from_the_tree_is_retired_only_by_its_own_shard()
    {
        string root = BuildCatalogue(tree, Photos);
        for (int k = 1; k <= Shards; k++)
        {
            Ingest(root, indexes.PathOf($"part-{k}.lookup"), new ShardSpec(k, Shards));
        }

        string removed = "opencv-fruits/fruits.jpg";
        File.Delete(Path.Combine(root, removed));
        var retired = Enumerable.Range(1, Shards)
            .Select(k => Ingest(root, indexes.PathOf($"part-{k}.lookup"), new ShardSpec(k, Shards)).Retired)
            .ToList();

        int owner = ShardSpec.Of(removed, Shards);
        Assert.Equal(Enumerable.Range(1, Shards).Select(k => k == owner ? 1 : 0), retired);
        Assert.DoesNotContain(removed, MergeTestParts.Read(indexes.PathOf($"part-{owner}.lookup")).Records.Keys);
    }

    public void Dispose()
    {
        tree.Dispose();
        indexes.Dispose();
    }

    /// <summary>Copies the photos into one folder per photo (the folder is the SKU) and adds an empty and a cut JPEG.</summary>
    internal static string BuildCatalogue(TempTree tree, IEnumerable<string> photos)
    {
        foreach (string photo in photos)
        {
            string source = Path.Combine(ReferenceData.Root, photo);
            tree.File($"{photo.Replace('/', '-')[..photo.LastIndexOf('.')]}/{Path.GetFileName(photo)}", File.ReadAllBytes(source));
        }

        byte[] jpeg = File.ReadAllBytes(ReferenceData.OpenCv("apple.jpg"));
        tree.File("broken-empty/empty.jpg", []);
        tree.File("broken-cut/cut.jpg", jpeg[..(jpeg.Length / 2)]);
        return tree.Root;
    }

    /// <summary>Same photos, same SHA-256, same status and SKU; vectors equal to float rounding; for every indexed
    /// photo the two nearest photos (itself, then its closest other photo) are the same in both indexes, at the
    /// same distances, up to the order of exact ties.</summary>
    internal static void AssertSameCatalogue(
        Dictionary<string, PhotoRecord> expected, HnswGraph expectedGraph, Dictionary<string, PhotoRecord> actual, HnswGraph actualGraph)
    {
        Assert.Equal(expected.Keys.Order(StringComparer.Ordinal), actual.Keys.Order(StringComparer.Ordinal));
        var expectedByNode = ByNode(expected);
        var actualByNode = ByNode(actual);
        foreach (var want in expected.Values)
        {
            var got = actual[want.Path];
            Assert.Equal((want.Sha256, want.Status, want.Sku, want.Size, want.DHash, want.FailureReason), (got.Sha256, got.Status, got.Sku, got.Size, got.DHash, got.FailureReason));
            if (want.NodeId is not int wantNode)
            {
                continue;
            }

            var wantVector = expectedGraph.GetVector(wantNode);
            var gotVector = actualGraph.GetVector(got.NodeId!.Value);
            Assert.True(1 - CosineKernel.Dot(wantVector, gotVector) < 1e-5f, $"{want.Path}: vectors differ");
            var wantTop = expectedGraph.Search(wantVector, 2);
            var gotTop = actualGraph.Search(wantVector, 2);
            for (int i = 0; i < wantTop.Length; i++)
            {
                string wantPath = expectedByNode[wantTop[i].Id];
                string gotPath = actualByNode[gotTop[i].Id];
                Assert.True(Math.Abs(wantTop[i].Distance - gotTop[i].Distance) < 1e-5f, $"{want.Path}: neighbour {i} at {wantTop[i].Distance} vs {gotTop[i].Distance}");
                if (gotPath != wantPath)
                {
                    // Only an exact tie may come out in another order (e.g. scikit-image's chessboard in big- and
                    // little-endian 16-bit TIFF: the same pixels, so the same embedding).
                    float tie = CosineKernel.Distance(wantVector, expectedGraph.GetVector(expected[gotPath].NodeId!.Value));
                    Assert.True(Math.Abs(tie - wantTop[i].Distance) < 1e-5f, $"{want.Path}: neighbour {i} is {wantPath} in one index and {gotPath} in the other");
                }
            }
        }

        Assert.Equal(expectedGraph.LiveCount, actualGraph.LiveCount);
    }

    private static Dictionary<int, string> ByNode(Dictionary<string, PhotoRecord> records) =>
        records.Values.Where(r => r.NodeId is not null).ToDictionary(r => r.NodeId!.Value, r => r.Path);

    private ShardSpec ShardWithMostPhotos(string root)
    {
        var paths = new CatalogueScanner().Scan(root).Entries.Select(e => e.RelativePath).ToList();
        int k = Enumerable.Range(1, Shards).MaxBy(k => paths.Count(p => ShardSpec.Of(p, Shards) == k));
        return new ShardSpec(k, Shards);
    }

    private IngestSummary Ingest(
        string root, string index, ShardSpec? shard, int workers = 1, int batchSize = 64, CancellationTokenSource? cancel = null, int stopAfter = 0)
    {
        using var file = IndexFile.Open(index, IndexAccess.Write);
        var options = new IngestOptions { Root = root, Workers = workers, BatchSize = batchSize, Shard = shard };
        IProgress<IngestProgress>? progress = cancel is null
            ? null
            : new Stopper(p =>
            {
                if (p.Stage == "embedding" && p.Done >= stopAfter)
                {
                    cancel.Cancel();
                }
            });
        return new CatalogueIngest(file, fixture.Embedder).Run(options, progress, cancel?.Token ?? default);
    }

    private sealed class Stopper(Action<IngestProgress> report) : IProgress<IngestProgress>
    {
        public void Report(IngestProgress value) => report(value);
    }
}

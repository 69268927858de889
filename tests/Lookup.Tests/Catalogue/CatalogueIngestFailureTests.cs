using Lookup.Catalogue;
using Lookup.Imaging;
using Lookup.Store;
using Lookup.Tests.Embedding;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// Photos that cannot be read at the moment ingest needs them: gone between the scan and the worker's read, or
/// refused by the operating system. The scan and the worker's read are replaced only where the real file system
/// cannot produce the fault on demand (a test running as root reads every file); the vanishing file is deleted for
/// real. Photos: open reference photos (tests/reference-data, see SOURCES.md).
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class CatalogueIngestFailureTests(EmbedderFixture fixture) : IDisposable
{
    private readonly IngestTree tree = new();

    [Fact]
    public void A_photo_deleted_after_the_scan_is_recorded_as_unreadable_and_the_other_photos_are_indexed()
    {
        Fill();
        var victim = tree.PathOf("BR-1/b.jpg");
        var deleteWhenEmbeddingStarts = new Hook(p =>
        {
            if (p is { Stage: "embedding", Done: 0 })
            {
                File.Delete(victim);
            }
        });

        var summary = EngineIngest.Run(tree, fixture.Embedder, progress: deleteWhenEmbeddingStarts);
        var index = IndexSnapshot.Read(tree.IndexPath);

        var failure = Assert.Single(summary.Failures);
        Assert.Equal(("BR-1/b.jpg", "Unreadable"), (failure.Path, failure.Reason));
        Assert.Contains(victim, failure.Message, StringComparison.Ordinal);
        Assert.Equal((1, 3), (summary.Failed, summary.Embedded));
        var record = index.Records["BR-1/b.jpg"];
        Assert.Equal((PhotoStatus.Failed, "Unreadable", null), (record.Status, record.FailureReason, record.NodeId));
        Assert.Equal(["BR-1/a.jpg", "BR-2/c.jpg", "BR-2/d.png"], index.Indexed.Select(r => r.Path).Order(StringComparer.Ordinal));

        var next = EngineIngest.Run(tree, fixture.Embedder);

        Assert.Equal((1, 0), (next.Retired, next.Failed));
        Assert.False(IndexSnapshot.Read(tree.IndexPath).Records.ContainsKey("BR-1/b.jpg"));
    }

    [Fact]
    public void A_photo_the_scan_may_not_open_is_recorded_as_access_denied_and_indexed_once_it_can_be_read()
    {
        Fill();
        var denied = tree.PathOf("BR-2/c.jpg");

        var summary = EngineIngest.Run(tree, fixture.Embedder, scanIo: DenyOpening(denied));
        var index = IndexSnapshot.Read(tree.IndexPath);

        var failure = Assert.Single(summary.Failures);
        Assert.Equal(("BR-2/c.jpg", "AccessDenied"), (failure.Path, failure.Reason));
        Assert.Contains(denied, failure.Message, StringComparison.Ordinal);
        Assert.Equal((1, 3), (summary.Failed, summary.Embedded));
        var record = index.Records["BR-2/c.jpg"];
        Assert.Equal((PhotoStatus.Failed, "AccessDenied"), (record.Status, record.FailureReason));
        Assert.Equal(failure.Message, record.FailureMessage);

        var next = EngineIngest.Run(tree, fixture.Embedder);
        var after = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal((1, 0), (next.Embedded, next.Failed));
        Assert.Equal(PhotoStatus.Indexed, after.Records["BR-2/c.jpg"].Status);
        var (found, hit) = after.Nearest(fixture.EmbedBytes(IngestTree.Bytes("opencv/fruits.jpg"), "fruits"));
        Assert.Equal("BR-2/c.jpg", found?.Path);
        Assert.True(hit.Distance < 1e-4f);
    }

    [Fact]
    public void An_indexed_photo_that_can_no_longer_be_opened_is_reported_and_stays_searchable()
    {
        Fill();
        EngineIngest.Run(tree, fixture.Embedder);
        var before = IndexSnapshot.Read(tree.IndexPath);

        var summary = EngineIngest.Run(tree, fixture.Embedder, scanIo: DenyOpening(tree.PathOf("BR-1/a.jpg")));
        var after = IndexSnapshot.Read(tree.IndexPath);

        var failure = Assert.Single(summary.Failures);
        Assert.Equal(("BR-1/a.jpg", "AccessDenied"), (failure.Path, failure.Reason));
        Assert.EndsWith("The version indexed before is kept.", failure.Message, StringComparison.Ordinal);
        Assert.Equal((0, 0), (summary.Retired, summary.Embedded));
        Assert.Equal(before.Digest(), after.Digest());
    }

    [Fact]
    public void A_photo_refused_when_the_worker_reads_it_is_recorded_and_read_again_by_the_next_run()
    {
        Fill();
        var refused = tree.PathOf("BR-2/d.png");
        byte[] Refuse(string path) => path == refused
            ? throw new UnauthorizedAccessException($"Access to the path '{path}' is denied.")
            : File.ReadAllBytes(path);

        var summary = EngineIngest.Run(tree, fixture.Embedder, readFile: Refuse);
        var record = IndexSnapshot.Read(tree.IndexPath).Records["BR-2/d.png"];

        Assert.Equal(("BR-2/d.png", "Unreadable"), (summary.Failures.Single().Path, summary.Failures.Single().Reason));
        Assert.Equal((PhotoStatus.Failed, "Unreadable"), (record.Status, record.FailureReason));

        var next = EngineIngest.Run(tree, fixture.Embedder);

        Assert.Equal((1, 1, 0), (next.Changed, next.Embedded, next.Failed));
        Assert.Equal(PhotoStatus.Indexed, IndexSnapshot.Read(tree.IndexPath).Records["BR-2/d.png"].Status);
    }

    [Fact]
    public void A_photo_refused_by_a_limit_stays_failed_until_retried_and_is_then_indexed()
    {
        Fill();
        var strict = EngineIngest.Options(tree) with { Limits = PhotoLimits.Default with { MaxPixels = 200_000 } };
        var first = EngineIngest.Run(tree, fixture.Embedder, strict);

        // apple.jpg and baboon.jpg are 512 × 512 (262,144 pixels), fruits.jpg 512 × 480, smarties.png 413 × 356.
        Assert.Equal(["BR-1/a.jpg", "BR-1/b.jpg", "BR-2/c.jpg"], first.Failures.Select(f => f.Path).Order(StringComparer.Ordinal));
        Assert.All(first.Failures, f => Assert.Equal("TooManyPixels", f.Reason));

        var unchanged = EngineIngest.Run(tree, fixture.Embedder);
        var retried = EngineIngest.Run(tree, fixture.Embedder, EngineIngest.Options(tree) with { RetryFailed = true });
        var index = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal((0, 4), (unchanged.Embedded, unchanged.Unchanged));
        Assert.Equal((3, 0), (retried.Embedded, retried.Failed));
        Assert.Empty(index.Failed);
        var (found, _) = index.Nearest(fixture.EmbedBytes(IngestTree.Bytes("opencv/baboon.jpg"), "baboon"));
        Assert.Equal(("BR-1/b.jpg", "BR-1"), (found?.Path, found?.Sku));
    }

    public void Dispose() => tree.Dispose();

    private static ScanIo DenyOpening(string path) => ScanIo.Default with
    {
        OpenRead = p => p == path
            ? throw new UnauthorizedAccessException($"Access to the path '{p}' is denied.")
            : ScanIo.Default.OpenRead(p),
    };

    private void Fill()
    {
        tree.Add("BR-1/a.jpg", "opencv/apple.jpg");
        tree.Add("BR-1/b.jpg", "opencv/baboon.jpg");
        tree.Add("BR-2/c.jpg", "opencv/fruits.jpg");
        tree.Add("BR-2/d.png", "opencv/smarties.png");
    }

    /// <summary>Reports progress on the engine's thread, at the moment it is reported.</summary>
    private sealed class Hook(Action<IngestProgress> action) : IProgress<IngestProgress>
    {
        public void Report(IngestProgress value) => action(value);
    }
}

using Lookup.Catalogue;
using Lookup.Imaging;
using Lookup.Store;
using Lookup.Tests.Embedding;
using Lookup.Tests.Imaging;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// The hostile corpus (<see cref="HostilePhotos"/>: truncated and damaged files of every format at many offsets,
/// decompression bombs, 10,000 frames, absurd EXIF, non-images under image names, a non-UTF-8 file name) ingested
/// by the engine together with good reference photos (tests/reference-data, see SOURCES.md).
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class HostileIngestTests(EmbedderFixture fixture) : IDisposable
{
    private readonly IngestTree tree = new();

    [Fact]
    public void Every_hostile_file_is_recorded_with_its_reason_and_every_good_photo_is_indexed()
    {
        var expected = HostileTree.Fill(tree);
        var options = EngineIngest.Options(tree) with { Limits = PhotoLimits.Default with { DecodeTimeout = HostileTree.DecodeLimit } };

        var summary = EngineIngest.Run(tree, fixture.Embedder, options);
        var index = IndexSnapshot.Read(tree.IndexPath);

        Assert.True(expected.Values.Count(r => r is not null) >= 30, "the corpus must hold at least 30 bad files");
        foreach (var (path, reason) in expected)
        {
            Assert.True(index.Records.TryGetValue(path, out var record), $"{path} has no record");
            if (reason is null)
            {
                Assert.True(record.Status == PhotoStatus.Indexed, $"{path} was not indexed: {record.FailureReason} {record.FailureMessage}");
                Assert.NotNull(record.NodeId);
            }
            else
            {
                Assert.True(record.Status == PhotoStatus.Failed && record.FailureReason == reason,
                    $"{path}: expected failure {reason}, got {record.Status} {record.FailureReason} {record.FailureMessage}");
                Assert.Contains(tree.PathOf(path), record.FailureMessage, StringComparison.Ordinal);
            }
        }

        Assert.Equal(expected.Values.Count(r => r is not null), summary.Failed);
        Assert.Equal(expected.Values.Count(r => r is null), index.Indexed.Count());
        var (found, hit) = index.Nearest(fixture.EmbedBytes(IngestTree.Bytes(IngestTree.Distinct[3]), "good"));
        Assert.Equal("GOOD-3/03.jpg", found?.Path);
        Assert.True(hit.Distance < 1e-4f);
    }

    [Fact]
    public void A_photo_whose_decode_outlasts_the_time_limit_is_recorded_as_timed_out_and_the_run_goes_on()
    {
        // With no time at all, every photo that reaches its pixel decode runs out; files refused earlier (by
        // their bytes or header) keep their own reason. This is the limit that bounds each file's time.
        var expected = HostileTree.Fill(tree);
        var options = EngineIngest.Options(tree) with { Limits = PhotoLimits.Default with { DecodeTimeout = TimeSpan.Zero } };

        var summary = EngineIngest.Run(tree, fixture.Embedder, options);
        var records = IndexSnapshot.Read(tree.IndexPath).Records;

        Assert.Equal(0, summary.Embedded);
        foreach (var (path, reason) in expected)
        {
            Assert.Equal(PhotoStatus.Failed, records[path].Status);
            if (reason is null)
            {
                Assert.Equal("TimedOut", records[path].FailureReason);
                Assert.Contains("decoding took longer than the limit of 0 s", records[path].FailureMessage, StringComparison.Ordinal);
            }
            else if (reason is not ("Corrupt" or "TooManyPixels"))
            {
                // Corrupt and over-size files may be found at the header, which is read under the same deadline.
                Assert.Equal(reason, records[path].FailureReason);
            }
        }
    }

    [Fact]
    public void A_file_whose_name_is_not_utf8_is_recorded_and_the_photos_beside_it_are_indexed()
    {
        if (!OperatingSystem.IsLinux())
        {
            return;
        }

        HostileTree.Fill(tree, hostile: false);
        var listed = HostileTree.AddNonUtf8Name(tree);

        var summary = EngineIngest.Run(tree, fixture.Embedder);
        var index = IndexSnapshot.Read(tree.IndexPath);

        Assert.Equal("caf\uFFFD-\uFFFD.jpg", listed);
        Assert.Equal(HostileTree.GoodPhotos + 1, summary.Scanned);
        Assert.Equal(HostileTree.GoodPhotos, index.Indexed.Count());
        var record = index.Records["CORPUS/" + listed];
        Assert.Equal((PhotoStatus.Failed, "Unreadable"), (record.Status, record.FailureReason));
        Assert.Contains("the name is not valid UTF-8", record.FailureMessage, StringComparison.Ordinal);
        var folder = Assert.Single(summary.ScanProblems);
        Assert.Equal(("CORPUS/Teile-\uFFFD", ScanProblemKind.ReadError), (folder.RelativePath, folder.Kind));
        Assert.EndsWith("rename it using UTF-8 characters; this folder was not scanned.", folder.Message, StringComparison.Ordinal);
        Assert.Equal(1, summary.Failed);

        var again = EngineIngest.Run(tree, fixture.Embedder);

        Assert.Equal((0, 1), (again.Embedded, again.Unchanged - HostileTree.GoodPhotos));
        Assert.Equal("Unreadable", IndexSnapshot.Read(tree.IndexPath).Records["CORPUS/" + listed].FailureReason);
    }

    public void Dispose()
    {
        HostileTree.RemoveNonUtf8Name(tree);
        tree.Dispose();
    }
}

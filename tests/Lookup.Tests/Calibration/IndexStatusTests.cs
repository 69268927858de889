using LiteDB;
using Lookup.Calibration;
using Lookup.Store;

namespace Lookup.Tests.Calibration;

/// <summary>Status of copies of the reference catalogue's index (see <see cref="ReferenceCatalogue"/>).</summary>
[Collection(ReferenceCatalogueCollection.Name)]
public sealed class IndexStatusTests(ReferenceCatalogue catalogue)
{
    [Fact]
    public void An_ingested_index_shows_its_photos_graph_model_and_that_it_is_not_calibrated()
    {
        var s = Read(catalogue.IndexPath);

        Assert.Equal(65, s.PhotosIndexed);
        Assert.Equal(0, s.PhotosFailed);
        Assert.Equal(55, s.Skus);
        Assert.Equal((65, 65, 0), (s.GraphNodes, s.GraphLive, s.GraphDeleted));
        Assert.Equal("resnet18", s.ModelName);
        Assert.Equal(catalogue.Embedder.Fingerprint, s.ModelFingerprint);
        Assert.Equal(Path.GetFullPath(catalogue.PhotosRoot), s.CatalogueRoot);
        Assert.True(s.CatalogueRootFound);
        Assert.Equal("folder", s.SkuMapping);
        Assert.Equal("default", s.Thresholds.Source);
        Assert.Null(s.Calibration);
        Assert.Equal((0, null), (s.Sweeps, s.LastSweepUtc));
        var warning = Assert.Single(s.Warnings);
        Assert.StartsWith("Not calibrated: match and sweep use the default thresholds", warning, StringComparison.Ordinal);
    }

    [Fact]
    public void A_freshly_calibrated_index_has_its_record_and_no_warning()
    {
        string path = catalogue.CopyOfIndex();
        Write(path, catalogue.Result.Store);

        var s = Read(path);

        Assert.Equal("calibrated", s.Thresholds.Source);
        Assert.NotNull(s.Calibration);
        Assert.Equal(catalogue.Result.Measured.StrangersInCopyBand, s.Calibration.StrangersInCopyBand);
        Assert.Empty(s.Warnings);
    }

    [Fact]
    public void An_index_grown_by_more_than_a_fifth_since_calibration_says_so()
    {
        string path = catalogue.CopyOfIndex();
        Write(path, file => (catalogue.Result.Thresholds with { PhotosAtCalibration = 50 }).Write(file));

        var warning = Assert.Single(Read(path).Warnings);

        Assert.Equal($"The index has grown by 30 % since calibration (50 → 65 photos): run 'lookup calibrate --index {path}' again.", warning);
    }

    [Fact]
    public void Thresholds_from_another_model_are_flagged()
    {
        string path = catalogue.CopyOfIndex();
        Write(path, file => (catalogue.Result.Thresholds with { ModelFingerprint = new string('a', 64) }).Write(file));

        var warning = Assert.Single(Read(path).Warnings);

        Assert.StartsWith("The thresholds were measured with another model (fingerprint aaaaaaaaaaaa…)", warning, StringComparison.Ordinal);
    }

    [Fact]
    public void The_last_sweep_is_the_latest_date_found_in_the_sweeps_collection()
    {
        string path = catalogue.CopyOfIndex();
        var latest = new DateTime(2026, 3, 4, 5, 6, 7, DateTimeKind.Utc);
        Write(path, file =>
        {
            var sweeps = file.Database.GetCollection("sweeps");
            sweeps.Insert(new BsonDocument { ["_id"] = 1, ["started"] = latest.AddDays(-1), ["note"] = "first" });
            sweeps.Insert(new BsonDocument { ["_id"] = 2, ["finishedUtc"] = latest, ["count"] = 3 });
            sweeps.Insert(new BsonDocument { ["_id"] = 3, ["note"] = "no date" });
        });

        var s = Read(path);

        Assert.Equal(3, s.Sweeps);
        Assert.Equal(latest, s.LastSweepUtc);
    }

    private static IndexStatus Read(string path)
    {
        using var file = IndexFile.Open(path, IndexAccess.Read);
        return IndexStatus.Read(file);
    }

    private static void Write(string path, Action<IndexFile> write)
    {
        using var file = IndexFile.Open(path, IndexAccess.Write);
        file.InTransaction(() => write(file));
    }
}

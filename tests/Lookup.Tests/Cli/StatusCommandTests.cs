using System.Text.Json;
using Lookup.Store;
using Lookup.Tests.Calibration;

namespace Lookup.Tests.Cli;

/// <summary>Runs the real <c>lookup status</c> in process on copies of the reference catalogue's index.</summary>
[Collection(ReferenceCatalogueCollection.Name)]
public sealed class StatusCommandTests(ReferenceCatalogue catalogue)
{
    [Fact]
    public void Status_of_a_calibrated_index_lists_photos_graph_model_catalogue_and_thresholds()
    {
        string index = catalogue.CopyOfIndex();
        using (var file = IndexFile.Open(index, IndexAccess.Write))
        {
            catalogue.Result.Store(file);
        }

        var (exitCode, output, error) = CalibrateCommandTests.Run("status", "--index", index);

        Assert.Equal(0, exitCode);
        Assert.Equal("", error);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal($"index         {index} (schema 1)", lines[0]);
        Assert.Equal("photos        65 indexed, 0 failed, 0 indexed without a SKU", lines[1]);
        Assert.Equal("SKUs          55", lines[2]);
        Assert.Equal("graph         65 nodes: 65 live, 0 retired (512 floats each)", lines[3]);
        Assert.StartsWith($"model         resnet18 (fingerprint {catalogue.Embedder.Fingerprint[..12]}…)", lines[4], StringComparison.Ordinal);
        Assert.StartsWith($"catalogue     {Path.GetFullPath(catalogue.PhotosRoot)} (found), SKUs from folder, last ingest ", lines[5], StringComparison.Ordinal);
        Assert.Matches(@"^thresholds    copy ≤ 0\.\d{3}, same part ≤ 0\.\d{3}, margin 0\.10 \(calibrated \d{4}-\d\d-\d\d \d\d:\d\d UTC on 16 sampled of 65 photos, target 1\.00 %\)$", lines[6]);
        Assert.StartsWith("measured      held-out strangers inside the copy band ", lines[7], StringComparison.Ordinal);
        Assert.Equal("last sweep    none", lines[8]);
        Assert.Equal(9, lines.Length);
    }

    [Fact]
    public void Status_with_json_of_an_uncalibrated_index_carries_the_warning()
    {
        var (exitCode, output, _) = CalibrateCommandTests.Run("status", "--index", catalogue.IndexPath, "--json");

        Assert.Equal(0, exitCode);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.Equal(65, root.GetProperty("photos").GetProperty("indexed").GetInt32());
        Assert.Equal(55, root.GetProperty("skus").GetInt32());
        Assert.Equal("default", root.GetProperty("thresholds").GetProperty("source").GetString());
        Assert.Equal(JsonValueKind.Null, root.GetProperty("calibration").ValueKind);
        Assert.StartsWith("Not calibrated:", root.GetProperty("warnings")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Status_of_a_missing_index_exits_1_naming_the_file()
    {
        string missing = Path.Combine(Path.GetTempPath(), "lookup-none-" + Guid.NewGuid().ToString("N") + ".lookup");

        var (exitCode, _, error) = CalibrateCommandTests.Run("status", "--index", missing);

        Assert.Equal(1, exitCode);
        Assert.StartsWith($"lookup status: {missing} does not exist", error, StringComparison.Ordinal);
    }
}

using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Lookup.Catalogue;
using Lookup.Cli;
using Lookup.Embedding;
using Lookup.Store;
using Lookup.Sweeps;
using Lookup.Tests.Calibration;
using Lookup.Tests.Store;
using Lookup.Tests.Sweeps;
using SixLabors.ImageSharp;

namespace Lookup.Tests.Cli;

/// <summary>Runs the real <c>lookup calibrate</c> in process on copies of the reference catalogue's index.</summary>
[Collection(ReferenceCatalogueCollection.Name)]
public sealed class CalibrateCommandTests(ReferenceCatalogue catalogue) : IDisposable
{
    private readonly TempIndex _temp = new();

    [Fact]
    public void Calibrate_prints_the_bands_with_held_out_rates_stores_them_and_writes_the_plot()
    {
        string index = catalogue.CopyOfIndex();
        string plot = Path.Combine(_temp.Directory, "calibration.png");

        var (exitCode, output, error) = Run("calibrate", "--index", index, "--sample", "6", "--seed", "3", "--target-false-match", "0.01", "--workers", "2", "--plot", plot, "--plot-size", "640x360", "--quiet");

        Assert.True(exitCode == 0, error);
        Assert.Equal("", error);
        using (var file = IndexFile.Open(index, IndexAccess.Read))
        {
            var stored = VerdictThresholds.ReadOrDefault(file);
            Assert.Equal("calibrated", stored.Source);
            Assert.Equal(6, stored.SampleSize);
            Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"copy       ≤ {stored.Copy:0.000}"), output, StringComparison.Ordinal);
            Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"same part  ≤ {stored.SamePart:0.000}"), output, StringComparison.Ordinal);
        }

        Assert.StartsWith($"Calibrated {index}: 65 photos under 55 SKUs, model resnet18", output, StringComparison.Ordinal);
        Assert.Contains("6 photos sampled (seed 3), 48 copies made", output, StringComparison.Ordinal);
        Assert.Contains("no match   > ", output, StringComparison.Ordinal);
        Assert.Contains("copies by edit (held out)", output, StringComparison.Ordinal);
        Assert.Contains($"Plot: {plot} (640 × 360).", output, StringComparison.Ordinal);
        Assert.EndsWith(Verdicts.SafetyNotice + "\n", output, StringComparison.Ordinal);
        using var image = Image.Load(plot);
        Assert.Equal((640, 360), (image.Width, image.Height));
    }

    [Fact]
    public void Calibrate_with_json_reports_thresholds_measured_rates_and_counts()
    {
        string index = catalogue.CopyOfIndex();

        var (exitCode, output, error) = Run("calibrate", "--index", index, "--sample", "4", "--target-false-match", "0.02", "--workers", "2", "--json", "--quiet");

        Assert.True(exitCode == 0, error);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.True(root.GetProperty("stored").GetBoolean());
        Assert.Equal("calibrated", root.GetProperty("thresholds").GetProperty("source").GetString());
        Assert.Equal(0.02, root.GetProperty("thresholds").GetProperty("targetFalseMatchRate").GetDouble());
        Assert.Equal(0.2, root.GetProperty("samePartFalseMatchRate").GetDouble(), 9);
        Assert.Equal(65, root.GetProperty("photos").GetInt32());
        Assert.Equal(32, root.GetProperty("copies").GetInt32());
        var strangers = root.GetProperty("heldOut").GetProperty("strangersInCopyBand");
        Assert.True(strangers.GetProperty("total").GetInt32() > 100);
        Assert.Equal(8, root.GetProperty("heldOut").GetProperty("byEdit").GetArrayLength());
        Assert.Equal(JsonValueKind.Array, root.GetProperty("warnings").ValueKind);
    }

    [Fact]
    public void Calibrate_of_a_missing_index_exits_1_naming_the_file()
    {
        string missing = Path.Combine(_temp.Directory, "nothing.lookup");

        var (exitCode, output, error) = Run("calibrate", "--index", missing);

        Assert.Equal(1, exitCode);
        Assert.Equal("", output);
        Assert.Equal($"lookup calibrate: {missing} does not exist: build it first with ingest, or check the --index path.\n", error);
    }

    [Fact]
    public void Calibrate_of_an_index_with_five_photos_exits_1_with_the_count_and_no_stack_trace()
    {
        var tree = Path.Combine(_temp.Directory, "photos");
        foreach (string photo in ReferencePhotos.Sources.Take(5))
        {
            string target = Path.Combine(tree, "SKU-" + Path.GetFileNameWithoutExtension(photo), Path.GetFileName(photo));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(ReferencePhotos.PathOf(photo), target);
        }

        using (var file = IndexFile.Open(_temp.Path, IndexAccess.Write))
        {
            new CatalogueIngest(file, catalogue.Embedder).Run(new IngestOptions { Root = tree, Workers = 2 });
        }

        var (exitCode, _, error) = Run("calibrate", "--index", _temp.Path);

        Assert.Equal(1, exitCode);
        Assert.StartsWith($"lookup calibrate: {_temp.Path} holds 5 indexed photos with a SKU; calibrate needs at least 20", error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Calibrate_with_another_model_card_is_refused_before_loading_it()
    {
        string card = Path.Combine(_temp.Directory, "other.json");
        (ModelCard.Default with { Name = "other-net", Scale = 0.5f }).Save(card);
        string index = catalogue.CopyOfIndex();

        var (exitCode, _, error) = Run("calibrate", "--index", index, "--model", card);

        Assert.Equal(1, exitCode);
        Assert.Contains("the model card 'other-net' gives", error, StringComparison.Ordinal);
        Assert.Contains("Copies must be embedded by the index's own model", error, StringComparison.Ordinal);
        using var file = IndexFile.Open(index, IndexAccess.Read);
        Assert.Equal("default", VerdictThresholds.ReadOrDefault(file).Source);
    }

    [Theory]
    [InlineData("--plot-size", "960")]
    [InlineData("--plot-size", "100x100")]
    [InlineData("--target-false-match", "0.5")]
    [InlineData("--sample", "0")]
    public void Calibrate_with_a_bad_value_is_a_usage_error(string option, string value)
    {
        var (exitCode, _, error) = Run("calibrate", "--index", catalogue.IndexPath, option, value);

        Assert.Equal(2, exitCode);
        Assert.StartsWith("lookup calibrate: ", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Calibrate_help_shows_an_example_and_the_exit_codes()
    {
        var (exitCode, output, _) = Run("calibrate", "--help");

        Assert.Equal(0, exitCode);
        Assert.Contains("lookup calibrate --index parts.lookup --sample 500 --plot calibration.png --json", output, StringComparison.Ordinal);
        Assert.Contains("Exit codes: 0 thresholds stored, 1 calibration not possible", output, StringComparison.Ordinal);
    }

    public void Dispose() => _temp.Dispose();

    internal static (int ExitCode, string Output, string Error) Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var exitCode = Program.Run(args, new InvocationConfiguration { Output = output, Error = error });
        return (exitCode, output.ToString(), error.ToString());
    }
}

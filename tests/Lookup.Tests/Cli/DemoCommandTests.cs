using System.Globalization;
using System.Text.Json;
using Lookup.Tests.Demo;
using Xunit.Abstractions;

namespace Lookup.Tests.Cli;

/// <summary>
/// The real <c>lookup demo</c> tour on the committed demo-catalogue (invented data, see demo-catalogue/README.md),
/// judged against the demo's own truth file read here independently of the command.
/// </summary>
public sealed class DemoCommandTests(DemoTourFixture tour, ITestOutputHelper log) : IClassFixture<DemoTourFixture>
{
    private const string TargetsNotMet =
        "Target of issue 8 not met yet (measured 2026-12-02 with the default ResNet18 and dense crops: top-3 11 of 15 = 73 %, " +
        "planted mistakes 5 of 6, the finish-only swap AB-40-ZN_4 missed); remove Skip when the engine or the demo data change.";

    [Fact]
    public void The_tour_answers_every_field_photo_of_the_truth_file_and_writes_the_report()
    {
        Assert.True(tour.ExitCode == 0, $"exit {tour.ExitCode}: {tour.Error}");
        var truth = TruthField();
        var field = tour.Root.GetProperty("field").EnumerateArray().ToList();

        Assert.Equal(truth.Select(t => t.File), field.Select(f => f.GetProperty("photo").GetString()));
        Assert.Equal(truth.Select(t => t.Sku), field.Select(f => f.GetProperty("trueSku").GetString()));
        Assert.All(field, f => Assert.True(f.GetProperty("ranking").GetArrayLength() >= 3, f.GetProperty("photo").GetString()));
        Assert.Equal(
            Directory.EnumerateFiles(DemoFolder.PathOf("photos"), "*.jpg", SearchOption.AllDirectories).Count(),
            tour.Root.GetProperty("ingest").GetProperty("indexedTotal").GetInt32());
        var html = File.ReadAllText(tour.Report);
        Assert.StartsWith("<!DOCTYPE html>", html, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("HN-M10-ZN_4.jpg", html, StringComparison.Ordinal);
        Assert.Contains("local codes and licensed practice", tour.Root.GetProperty("caution").GetString(), StringComparison.Ordinal);

        // Recomputed from the rankings and the truth file, not taken from the command's own counts.
        var stocked = field.Where(f => f.GetProperty("trueSku").ValueKind != JsonValueKind.Null).ToList();
        int topOne = stocked.Count(f => TopSkus(f, 1).Contains(f.GetProperty("trueSku").GetString()));
        int topThree = stocked.Count(f => TopSkus(f, 3).Contains(f.GetProperty("trueSku").GetString()));
        var accuracy = tour.Root.GetProperty("accuracy");
        Assert.Equal(topOne, accuracy.GetProperty("topOneRight").GetInt32());
        Assert.Equal(topThree, accuracy.GetProperty("topThreeRight").GetInt32());
        log.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"Tour wall time {tour.WallTime.TotalSeconds:0.0} s; top-1 {topOne} of {stocked.Count} ({(double)topOne / stocked.Count:P0}), " +
            $"top-3 {topThree} of {stocked.Count} ({(double)topThree / stocked.Count:P0}); planted mistakes found " +
            $"{tour.Root.GetProperty("defectsFound").GetInt32()} of {tour.Root.GetProperty("defectsPlanted").GetInt32()}."));
        foreach (var d in tour.Root.GetProperty("defects").EnumerateArray())
        {
            log.WriteLine($"{d.GetProperty("kind").GetString(),-22} {string.Join(", ", d.GetProperty("files").EnumerateArray().Select(f => f.GetString())),-80} " +
                $"{(d.GetProperty("found").GetBoolean() ? $"found as {d.GetProperty("findingKind").GetString()}" : "MISSED")}");
        }
    }

    [Fact(Skip = TargetsNotMet)]
    public void The_sweep_finds_every_planted_mistake()
    {
        Assert.True(tour.ExitCode == 0, $"exit {tour.ExitCode}: {tour.Error}");
        var defects = tour.Root.GetProperty("defects").EnumerateArray().ToList();

        Assert.Equal(TruthDefectCount(), defects.Count);
        Assert.All(defects, d => Assert.True(d.GetProperty("found").GetBoolean(), d.GetProperty("note").GetString()));
    }

    [Fact(Skip = TargetsNotMet)]
    public void The_right_sku_is_in_the_top_three_for_at_least_80_percent_of_stocked_field_photos()
    {
        Assert.True(tour.ExitCode == 0, $"exit {tour.ExitCode}: {tour.Error}");
        var stocked = tour.Root.GetProperty("field").EnumerateArray().Where(f => f.GetProperty("trueSku").ValueKind != JsonValueKind.Null).ToList();
        int inTopThree = stocked.Count(f => TopSkus(f, 3).Contains(f.GetProperty("trueSku").GetString()));

        Assert.True(inTopThree >= 0.8 * stocked.Count, $"top-3 {inTopThree} of {stocked.Count}");
    }

    private static List<string?> TopSkus(JsonElement fieldRow, int count) =>
        [.. fieldRow.GetProperty("ranking").EnumerateArray().Take(count).Select(r => r.GetProperty("sku").GetString())];

    private static List<(string? File, string? Sku)> TruthField()
    {
        using var truth = JsonDocument.Parse(File.ReadAllText(DemoFolder.PathOf("truth.json")));
        return [.. truth.RootElement.GetProperty("field").EnumerateArray()
            .Select(f => (f.GetProperty("file").GetString(), f.GetProperty("sku").ValueKind == JsonValueKind.Null ? null : f.GetProperty("sku").GetString()))];
    }

    private static int TruthDefectCount()
    {
        using var truth = JsonDocument.Parse(File.ReadAllText(DemoFolder.PathOf("truth.json")));
        return truth.RootElement.GetProperty("defects").GetArrayLength();
    }
}

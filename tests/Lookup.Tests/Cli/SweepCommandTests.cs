using Lookup.Store;
using Lookup.Sweeps;
using Lookup.Tests.Sweeps;
using Xunit.Abstractions;
using static Lookup.Tests.Sweeps.IngestedCatalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// The real <c>lookup sweep</c> command on a tree of real photos with planted copies, ingested by the real
/// <c>lookup ingest</c> (see <see cref="IngestedCatalogue"/>).
/// </summary>
[Collection(IngestedCatalogueCollection.Name)]
public sealed class SweepCommandTests(IngestedCatalogue catalogue, ITestOutputHelper log)
{
    [Fact]
    public void Sweep_finds_every_planted_copy_with_its_kind_and_nothing_among_distinct_photos()
    {
        var (exitCode, output, error) = RunCommand("sweep", "--index", catalogue.Index, "--json", "--no-store", "--quiet");

        Assert.True(exitCode == 3, error);
        var sweep = SweepJson.Parse(output);
        var misses = new List<string>();
        foreach (var (copy, (edit, relation, edits, original)) in catalogue.Plants)
        {
            var finding = sweep.Findings.SingleOrDefault(f => f.Paths.Contains(copy) && f.Paths.Contains(original));
            var pair = finding?.Pairs.SingleOrDefault(p => p.Joins(copy, original));
            var expectedKind = Path.GetDirectoryName(copy) == Path.GetDirectoryName(original) ? FindingKind.CopiesInOneSku : FindingKind.SamePhotoSeveralSkus;
            var groupKind = finding is null ? (FindingKind?)null : Enum.Parse<FindingKind>(finding.Kind, ignoreCase: true);
            var ok = pair is not null
                && Enum.Parse<PairRelation>(pair.Relation, ignoreCase: true) == relation
                && Enum.Parse<CopyEdits>(pair.Edits, ignoreCase: true) == edits
                && (groupKind == expectedKind || groupKind == FindingKind.SamePhotoSeveralSkus);
            log.WriteLine($"{original,-22} {edit,-17} → {(pair is null ? "not paired" : $"{pair.Relation} ({pair.Edits}) at {pair.Distance:0.0000}, {groupKind}")}");
            if (!ok)
            {
                misses.Add($"{copy}: expected {relation} ({edits}) in a {expectedKind} finding");
            }
        }

        // Each source's group holds its original and all its copies; a group with a byte copy in another SKU is
        // "same photo under several SKUs", the others "copies inside one SKU".
        foreach (var group in catalogue.SourceOf.GroupBy(p => p.Value).Where(g => g.Count() > 2))
        {
            var finding = sweep.Findings.Single(f => f.Paths.Contains(group.First().Key) && f.Pairs.Count > 0);
            var severalSkus = group.Select(p => Path.GetDirectoryName(p.Key)).Distinct().Count() > 1;
            Assert.Equal(severalSkus ? FindingKind.SamePhotoSeveralSkus : FindingKind.CopiesInOneSku, Enum.Parse<FindingKind>(finding.Kind, ignoreCase: true));
            Assert.Equal(group.Select(p => p.Key).Order(), finding.Paths.Order());
        }

        var (truePairs, reportedPairs, plantedPairs) = Score(sweep);
        log.WriteLine($"same-photo pairs: precision {truePairs}/{reportedPairs}, recall {truePairs}/{plantedPairs}; " +
            $"planted copies found with the right relation and kind: {catalogue.Plants.Count - misses.Count}/{catalogue.Plants.Count}");
        Assert.Empty(misses);
        Assert.All(sweep.Findings, f => Assert.Single(f.Paths.Select(p => catalogue.SourceOf[p]).Distinct()));
        Assert.Equal(reportedPairs, truePairs);
    }

    [Fact]
    public void Sweep_prints_one_table_per_kind_most_severe_first_and_ends_with_the_safety_notice()
    {
        var (exitCode, output, _) = RunCommand("sweep", "--index", catalogue.Index, "--no-store", "--quiet");

        Assert.Equal(3, exitCode);
        var lines = output.TrimEnd('\n').Split('\n');
        Assert.Equal(Verdicts.SafetyNotice, lines[^1]);
        var samePhoto = Array.FindIndex(lines, l => l.StartsWith("Same photo under several SKUs: 7 findings, 7 new", StringComparison.Ordinal));
        var copies = Array.FindIndex(lines, l => l.StartsWith("Copies inside one SKU: 6 findings, 6 new", StringComparison.Ordinal));
        Assert.True(samePhoto > 0 && copies > samePhoto, output);
        Assert.Contains($"Paths are relative to the catalogue root {catalogue.Tree}.", output, StringComparison.Ordinal);
        Assert.Contains("Not stored (--no-store).", output, StringComparison.Ordinal);
        var header = lines[samePhoto + 2];
        Assert.Equal(["#", "new", "SKU", "photo", "distance", "verdict", "key"], header.Split(' ', StringSplitOptions.RemoveEmptyEntries));
        var hostileRow = lines.Single(l => l.Contains(catalogue.HostilePath, StringComparison.Ordinal));
        Assert.Equal(header.IndexOf("photo", StringComparison.Ordinal), hostileRow.IndexOf(catalogue.HostilePath, StringComparison.Ordinal));
    }

    [Fact]
    public void Sweep_stores_itself_and_new_only_reports_exactly_the_copy_added_since()
    {
        using var workspace = catalogue.CopyWorkspace();
        Assert.Equal(3, RunCommand("sweep", "--index", workspace.Index, "--quiet").ExitCode);
        var (quietExit, quietOutput, _) = RunCommand("sweep", "--index", workspace.Index, "--new-only", "--quiet");
        Assert.Equal(0, quietExit);
        Assert.Contains("No new findings.", quietOutput, StringComparison.Ordinal);

        // One more copy: graf1 (so far alone in its group) re-saved as JPEG q40 under a new SKU.
        var decoder = new Lookup.Imaging.PhotoDecoder();
        var graf1 = File.ReadAllBytes(Path.Combine(workspace.Tree, "V0", "graf1.png"));
        using (var decoded = decoder.Decode(graf1, "graf1.png"))
        {
            Directory.CreateDirectory(Path.Combine(workspace.Tree, "NEW-1"));
            File.WriteAllBytes(Path.Combine(workspace.Tree, "NEW-1", "graf1 again.jpg"), PlantedEdits.Apply("jpeg q40", decoded.Image, graf1));
        }

        Assert.Equal(0, RunCommand("ingest", workspace.Tree, "--index", workspace.Index, "--quiet").ExitCode);
        var (exitCode, output, error) = RunCommand("sweep", "--index", workspace.Index, "--new-only", "--json", "--quiet");

        Assert.True(exitCode == 3, error);
        var sweep = SweepJson.Parse(output);
        var finding = Assert.Single(sweep.Findings);
        Assert.Equal(["NEW-1/graf1 again.jpg", "V0/graf1.png"], finding.Paths.Order(StringComparer.Ordinal));
        Assert.Equal("samePhotoSeveralSkus", finding.Kind);
        Assert.Equal([finding.Key], sweep.NewFindingKeys);
        Assert.Equal((3, 2), (sweep.Sweep, sweep.PreviousSweep));
    }

    [Fact]
    public void Fail_on_limits_the_exit_code_to_new_findings_of_the_kinds_named()
    {
        Assert.Equal(0, RunCommand("sweep", "--index", catalogue.Index, "--no-store", "--quiet", "--fail-on", "look-alikes,far-from-sku").ExitCode);
        Assert.Equal(3, RunCommand("sweep", "--index", catalogue.Index, "--no-store", "--quiet", "--fail-on", "far-from-sku, copies").ExitCode);
    }

    [Theory]
    [InlineData("--fail-on", "duplicates")]
    [InlineData("--json", "--csv", "-")]
    [InlineData("--threads", "-1")]
    public void Sweep_with_bad_options_is_a_usage_error(params string[] options)
    {
        var (exitCode, _, error) = RunCommand(["sweep", "--index", catalogue.Index, .. options]);

        Assert.Equal(2, exitCode);
        Assert.StartsWith("lookup sweep: ", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Sweep_of_a_missing_index_exits_1_naming_the_file()
    {
        var missing = Path.Combine(catalogue.Root, "nowhere.lookup");

        var (exitCode, output, error) = RunCommand("sweep", "--index", missing, "--quiet");

        Assert.Equal(1, exitCode);
        Assert.Equal("", output);
        Assert.Contains(missing, error, StringComparison.Ordinal);
    }

    [Fact]
    public void Sweep_while_another_writer_holds_the_index_reports_without_storing_and_says_who()
    {
        using var workspace = catalogue.CopyWorkspace();
        int exitCode;
        string output;
        using (IndexFile.Open(workspace.Index, IndexAccess.Write))
        {
            (exitCode, output, var error) = RunCommand("sweep", "--index", workspace.Index, "--quiet");
            Assert.Contains("not stored:", error, StringComparison.Ordinal);
            Assert.Contains($"pid {Environment.ProcessId}", error, StringComparison.Ordinal);
        }

        Assert.Equal(3, exitCode);
        Assert.Contains("Same photo under several SKUs: 7 findings, 7 new", output, StringComparison.Ordinal);
        Assert.Contains("Not stored: ", output, StringComparison.Ordinal);

        // Nothing was stored, so the next sweep still calls every finding new and becomes sweep 1.
        var (nextExit, nextOutput, _) = RunCommand("sweep", "--index", workspace.Index, "--new-only", "--json", "--quiet");
        Assert.Equal(3, nextExit);
        var next = SweepJson.Parse(nextOutput);
        Assert.Equal((1, true, (int?)null), (next.Sweep, next.Stored, next.PreviousSweep));
        Assert.Equal(next.Findings.Count, next.NewFindingKeys.Count);
    }

    [Fact]
    public void Sweep_writes_csv_to_stdout_with_a_row_per_photo_and_nothing_else()
    {
        var (exitCode, output, _) = RunCommand("sweep", "--index", catalogue.Index, "--no-store", "--quiet", "--csv", "-");

        Assert.Equal(3, exitCode);
        var rows = output.Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("finding,kind,finding_key,role,sku,path,", rows[0], StringComparison.Ordinal);
        Assert.Equal(catalogue.SourceOf.Count - 7, rows.Length - 1);
    }

    private (int True, int Reported, int Planted) Score(SweepJson sweep)
    {
        var reported = sweep.Findings
            .Where(f => f.Kind is "samePhotoSeveralSkus" or "copiesInOneSku")
            .SelectMany(f => f.Pairs)
            .Select(p => (p.First, p.Second))
            .ToList();
        var truePairs = reported.Count(p => catalogue.SourceOf[p.First] == catalogue.SourceOf[p.Second]);
        var planted = catalogue.SourceOf.GroupBy(p => p.Value).Sum(g => g.Count() * (g.Count() - 1) / 2);
        return (truePairs, reported.Count, planted);
    }
}

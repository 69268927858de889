using Lookup.Store;
using Lookup.Sweeps;
using Lookup.Tests.Sweeps;
using static Lookup.Tests.Sweeps.IngestedCatalogue;

namespace Lookup.Tests.Cli;

/// <summary>The real <c>lookup dismiss</c> command, and later sweeps of the same index (see <see cref="IngestedCatalogue"/>).</summary>
[Collection(IngestedCatalogueCollection.Name)]
public sealed class SweepDismissCommandTests(IngestedCatalogue catalogue)
{
    [Fact]
    public void A_dismissed_pair_never_returns_not_even_after_one_photo_is_renamed()
    {
        using var workspace = catalogue.CopyWorkspace();
        var first = SweepOf(workspace);
        Assert.Contains(first.Findings, f => f.Paths.Contains(catalogue.HostilePath));

        var (exitCode, output, error) = RunCommand(
            "dismiss", "--index", workspace.Index, "--pair", catalogue.Graf3Path, catalogue.HostilePath, "--note", "kept on purpose", "--reviewer", "ana");

        Assert.True(exitCode == 0, error);
        Assert.StartsWith("dismissed  Dismissed the pair ", output, StringComparison.Ordinal);
        Assert.EndsWith(Verdicts.SafetyNotice + "\n", output, StringComparison.Ordinal);
        Assert.DoesNotContain(SweepOf(workspace).Findings, f => f.Paths.Contains(catalogue.HostilePath));

        Directory.CreateDirectory(Path.Combine(workspace.Tree, "RENAMED"));
        File.Move(Path.Combine(workspace.Tree, catalogue.HostilePath), Path.Combine(workspace.Tree, "RENAMED", "graf3 renamed.png"));
        Assert.Equal(0, RunCommand("ingest", workspace.Tree, "--index", workspace.Index, "--quiet").ExitCode);
        var afterRename = SweepOf(workspace);
        Assert.DoesNotContain(afterRename.Findings, f => f.Paths.Contains(catalogue.Graf3Path));
        Assert.Equal(first.Findings.Count - 1, afterRename.Findings.Count);

        using var index = IndexFile.Open(workspace.Index, IndexAccess.Read);
        var decision = Assert.Single(new DecisionStore(index).All());
        Assert.Equal((DecisionTarget.Pair, "ana", "kept on purpose"), (decision.Target, decision.Reviewer, decision.Note));
        Assert.Equal([catalogue.Graf3Path, catalogue.HostilePath], decision.Paths);
    }

    [Fact]
    public void Dismissing_a_finding_by_key_prefix_removes_it_and_a_second_dismissal_leaves_the_first_standing()
    {
        using var workspace = catalogue.CopyWorkspace();
        var copies = SweepOf(workspace).Findings.First(f => f.Kind == "copiesInOneSku");

        var (exitCode, output, _) = RunCommand("dismiss", "--index", workspace.Index, copies.Key[..12], "--reviewer", "ana");
        var (againExit, againOutput, _) = RunCommand("dismiss", "--index", workspace.Index, copies.Key[..12], "--reviewer", "ben");

        // Pair keys rest on content: the byte copy's pairs share keys with the original's, so fewer keys than pairs.
        var pairKeys = copies.Pairs.Select(p => p.Key).Distinct().Count();
        Assert.Equal(0, exitCode);
        Assert.True(pairKeys < copies.Pairs.Count);
        Assert.Contains($"Dismissed the finding {copies.Key} (Copies inside one SKU, 8 photos) with {pairKeys} of its pairs", output, StringComparison.Ordinal);
        Assert.Equal(0, againExit);
        Assert.StartsWith("unchanged  ", againOutput, StringComparison.Ordinal);
        Assert.Contains("already dismissed by ana", againOutput, StringComparison.Ordinal);
        var after = SweepOf(workspace);
        Assert.DoesNotContain(after.Findings, f => f.Paths.Intersect(copies.Paths).Any() && f.Pairs.Count > 0);
    }

    [Fact]
    public void Dismissing_from_a_reviewed_sweep_csv_takes_rows_marked_not_duplicate_once_each()
    {
        using var workspace = catalogue.CopyWorkspace();
        var csvPath = Path.Combine(workspace.Root, "sweep.csv");
        Assert.Equal(3, RunCommand("sweep", "--index", workspace.Index, "--csv", csvPath, "--quiet").ExitCode);
        var lines = File.ReadAllLines(csvPath);
        var keys = lines.Skip(1).Select(l => l.Split(',')[2]).Distinct().ToList();
        var (dismissed, kept) = (keys[0], keys[1]);

        // The reviewer keeps the sweep's columns, adds a decision and a note, and marks every row of one finding.
        var reviewed = Path.Combine(workspace.Root, "reviewed.csv");
        File.WriteAllLines(reviewed, [
            lines[0] + ",decision,note",
            .. lines.Skip(1).Select(l => l + (l.Contains(dismissed, StringComparison.Ordinal) ? ",not-duplicate,\"a kit, and its part\"" : ",,")),
        ]);
        var (exitCode, output, error) = RunCommand("dismiss", "--index", workspace.Index, "--from", reviewed);

        Assert.True(exitCode == 0, error + output);
        Assert.Single(output.Split('\n'), l => l.StartsWith("dismissed", StringComparison.Ordinal));
        Assert.Contains("reviewed.csv line 2: Dismissed the finding " + dismissed, output, StringComparison.Ordinal);
        var after = SweepOf(workspace);
        Assert.DoesNotContain(after.Findings, f => f.Key == dismissed);
        Assert.Contains(after.Findings, f => f.Key == kept);
        using var index = IndexFile.Open(workspace.Index, IndexAccess.Read);
        Assert.Equal("a kit, and its part", new DecisionStore(index).Find(dismissed)!.Note);
    }

    [Fact]
    public void Dismiss_reports_unknown_keys_and_paths_and_exits_1_but_records_the_rest()
    {
        using var workspace = catalogue.CopyWorkspace();
        var finding = SweepOf(workspace).Findings[0];

        var (exitCode, output, _) = RunCommand(
            "dismiss", "--index", workspace.Index, "00000000", finding.Key, "zz", "--pair", "S0/apple.jpg", "S0/nothing.jpg");

        Assert.Equal(1, exitCode);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("not found  No finding or pair of the stored sweeps has a key starting with 00000000", lines[0], StringComparison.Ordinal);
        Assert.StartsWith("dismissed  ", lines[1], StringComparison.Ordinal);
        Assert.StartsWith("not found  \"zz\" is not a key", lines[2], StringComparison.Ordinal);
        Assert.StartsWith($"not found  S0/nothing.jpg is not a photo of this index (paths are relative to the catalogue root {catalogue.Tree})", lines[3], StringComparison.Ordinal);
        Assert.DoesNotContain(SweepOf(workspace).Findings, f => f.Key == finding.Key);
    }

    [Fact]
    public void Dismiss_while_another_writer_holds_the_index_exits_1_naming_it()
    {
        using var workspace = catalogue.CopyWorkspace();
        using var writer = IndexFile.Open(workspace.Index, IndexAccess.Write);

        var (exitCode, _, error) = RunCommand("dismiss", "--index", workspace.Index, "--pair", "S0/apple.jpg", catalogue.Graf3Path);

        Assert.Equal(1, exitCode);
        Assert.Contains($"is being written by pid {Environment.ProcessId}", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Dismiss_without_anything_to_dismiss_is_a_usage_error()
    {
        var (exitCode, _, error) = RunCommand("dismiss", "--index", catalogue.Index);

        Assert.Equal(2, exitCode);
        Assert.Contains("give a finding key, --pair PATH PATH, or --from FILE", error, StringComparison.Ordinal);
    }

    [Fact]
    public void List_shows_each_decision_once_and_undo_brings_a_dismissed_finding_back()
    {
        using var workspace = catalogue.CopyWorkspace();
        var before = SweepOf(workspace);
        var copies = before.Findings.First(f => f.Kind == "copiesInOneSku");
        Assert.Equal(0, RunCommand("dismiss", "--index", workspace.Index, copies.Key[..12], "--reviewer", "ana", "--note", "kit photos").ExitCode);
        Assert.Equal(0, RunCommand("dismiss", "--index", workspace.Index, "--pair", catalogue.Graf3Path, catalogue.HostilePath, "--reviewer", "ben").ExitCode);
        var pairKeys = copies.Pairs.Select(p => p.Key).Distinct().Count();

        var (listExit, list, listError) = RunCommand("dismiss", "--index", workspace.Index, "--list");

        Assert.True(listExit == 0, listError);
        var rows = list.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("key ", rows[0], StringComparison.Ordinal);
        Assert.Single(rows, r => r.StartsWith(copies.Key[..12], StringComparison.Ordinal) && r.Contains($"finding ({pairKeys} pairs)", StringComparison.Ordinal)
            && r.Contains("ana", StringComparison.Ordinal) && r.EndsWith("kit photos", StringComparison.Ordinal));
        Assert.Single(rows, r => r.Contains("  pair  ", StringComparison.Ordinal) && r.Contains("ben", StringComparison.Ordinal));
        Assert.Contains("2 decisions.", list, StringComparison.Ordinal);
        Assert.DoesNotContain(SweepOf(workspace).Findings, f => f.Key == copies.Key);

        var (undoExit, undo, undoError) = RunCommand("dismiss", "--index", workspace.Index, "--undo", copies.Key[..10]);

        Assert.True(undoExit == 0, undoError + undo);
        Assert.Contains($"Took back ana's decision on finding {copies.Key} and the {pairKeys} pair decision(s) recorded with it", undo, StringComparison.Ordinal);
        Assert.Contains(SweepOf(workspace).Findings, f => f.Key == copies.Key);
        using (var index = IndexFile.Open(workspace.Index, IndexAccess.Read))
        {
            var left = Assert.Single(new DecisionStore(index).All());
            Assert.Equal(("ben", DecisionTarget.Pair), (left.Reviewer, left.Target));
        }

        var (againExit, again, _) = RunCommand("dismiss", "--index", workspace.Index, "--undo", copies.Key[..10]);
        Assert.Equal(1, againExit);
        Assert.Contains("No decision has a key starting", again, StringComparison.Ordinal);
    }

    [Fact]
    public void Undo_with_something_to_dismiss_as_well_is_a_usage_error()
    {
        var (exitCode, _, error) = RunCommand("dismiss", "--index", catalogue.Index, "--undo", "0123456789ab", "--pair", "a.jpg", "b.jpg");

        Assert.Equal(2, exitCode);
        Assert.Contains("--list and --undo each go alone", error, StringComparison.Ordinal);
    }

    /// <summary>Sweeps and stores (so the findings can be dismissed by key), returning the JSON.</summary>
    private static SweepJson SweepOf(IngestedCatalogue.Workspace workspace)
    {
        var (exitCode, output, error) = RunCommand("sweep", "--index", workspace.Index, "--json", "--quiet");
        Assert.True(exitCode is 0 or 3, error);
        return SweepJson.Parse(output);
    }
}

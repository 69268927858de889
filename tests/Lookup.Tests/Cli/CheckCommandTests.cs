using System.Text.Json;
using Lookup.Store;
using Lookup.Tests.Store;

namespace Lookup.Tests.Cli;

/// <summary>Runs the real <c>lookup check</c> in process on a small index damaged on purpose (see <see cref="CheckedIndex"/>).</summary>
public sealed class CheckCommandTests : IDisposable
{
    private readonly CheckedIndex index = new();

    [Fact]
    public void Check_of_a_sound_index_says_clean_and_exits_0()
    {
        var (exitCode, output, error) = CalibrateCommandTests.Run("check", "--index", index.Path);

        Assert.Equal(0, exitCode);
        Assert.Equal("", error);
        Assert.Equal(
            [$"index    {index.Path}: 60 photo records, 60 graph nodes (60 live), {index.Check().Links:N0} links", "result   clean."],
            output.Split('\n', StringSplitOptions.RemoveEmptyEntries));
    }

    [Fact]
    public void Check_names_an_orphan_node_with_the_fix_and_exits_1_then_repair_exits_0_with_a_clean_index()
    {
        index.Change((graph, _) => graph.Add(index.Vectors[2]));

        var (exitCode, output, _) = CalibrateCommandTests.Run("check", "--index", index.Path);

        Assert.Equal(1, exitCode);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("ERROR    orphan-node (1): 1 live node(s) belong to no photo record", lines[1], StringComparison.Ordinal);
        Assert.Equal("         fix: check --repair rebuilds the graph without them.", lines[2]);
        Assert.Equal($"result   1 error(s), 0 warning(s). Repairable ones: lookup check --index {index.Path} --repair", lines[3]);

        var (repairExit, json, repairError) = CalibrateCommandTests.Run("check", "--index", index.Path, "--repair", "--json");

        Assert.True(repairExit == 0, repairError);
        using var doc = JsonDocument.Parse(json);
        var root = doc.RootElement;
        Assert.False(root.GetProperty("healthy").GetBoolean());
        var finding = Assert.Single(root.GetProperty("findings").EnumerateArray());
        Assert.Equal("orphan-node", finding.GetProperty("code").GetString());
        Assert.Equal("error", finding.GetProperty("severity").GetString());
        Assert.True(finding.GetProperty("repairable").GetBoolean());
        var repair = root.GetProperty("repair");
        Assert.True(repair.GetProperty("graphRebuilt").GetBoolean());
        Assert.Equal(60, repair.GetProperty("nodesKept").GetInt32());
        Assert.Equal(1, repair.GetProperty("nodesDropped").GetInt32());
        Assert.True(repair.GetProperty("after").GetProperty("healthy").GetBoolean());
        Assert.Equal(0, repair.GetProperty("after").GetProperty("findings").GetArrayLength());
        Assert.Equal(0, CalibrateCommandTests.Run("check", "--index", index.Path).ExitCode);
    }

    [Fact]
    public void Repair_lists_the_photos_the_next_ingest_must_embed_again()
    {
        int node = index.RecordOf(9).NodeId!.Value;
        index.Raw(db => db.GetCollection("graph_vectors").Delete(node));

        var (exitCode, output, _) = CalibrateCommandTests.Run("check", "--index", index.Path, "--repair");

        Assert.Equal(0, exitCode);
        Assert.Contains("repair   graph rebuilt from the stored vectors: 59 nodes kept, 1 left out (retired, orphaned or damaged).", output, StringComparison.Ordinal);
        Assert.Contains($"repair   1 photo record(s) removed; the next ingest embeds those photos again:\n         {CheckedIndex.PathOf(9)}\n", output, StringComparison.Ordinal);
        Assert.EndsWith("after repair:\nresult   clean.\n", output, StringComparison.Ordinal);
    }

    [Fact]
    public void An_error_repair_cannot_mend_keeps_exit_code_1_after_repair()
    {
        index.Raw(db =>
        {
            var settings = db.GetCollection("catalogue_meta").FindById("settings");
            settings["fp"] = new string('0', 64);
            db.GetCollection("catalogue_meta").Upsert(settings);
        });

        var (exitCode, output, _) = CalibrateCommandTests.Run("check", "--index", index.Path, "--repair");

        Assert.Equal(1, exitCode);
        Assert.Contains("ERROR    model-mismatch (1)", output, StringComparison.Ordinal);
        Assert.Contains("repair   nothing to repair.", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Repair_while_another_writer_holds_the_index_is_refused_naming_it()
    {
        using var holder = IndexFile.Open(index.Path, IndexAccess.Write);

        var (exitCode, _, error) = CalibrateCommandTests.Run("check", "--index", index.Path, "--repair");

        Assert.Equal(1, exitCode);
        Assert.StartsWith($"lookup check: {index.Path} is being written by pid {Environment.ProcessId}", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_help_shows_examples_and_every_exit_code()
    {
        var (exitCode, output, _) = CalibrateCommandTests.Run("check", "--help");

        Assert.Equal(0, exitCode);
        Assert.Contains("  lookup check --index parts.lookup\n", output, StringComparison.Ordinal);
        Assert.Contains("  lookup check --index parts.lookup --repair --json\n", output, StringComparison.Ordinal);
        Assert.Contains("Exit codes: 0 no errors", output, StringComparison.Ordinal);
        Assert.Contains("1 errors", output, StringComparison.Ordinal);
        Assert.Contains("found or left, or the index could not be opened, 2 usage error.", output, StringComparison.Ordinal);
    }

    public void Dispose() => index.Dispose();
}

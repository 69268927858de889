using System.CommandLine;
using System.Text.Json;
using Lookup.Cli;
using Lookup.Tests.Store;
using static Lookup.Tests.Catalogue.MergeTestParts;

namespace Lookup.Tests.Catalogue;

/// <summary>The real <c>lookup merge</c> command, run in process with its output captured, on synthetic parts.</summary>
public sealed class MergeCommandTests : IDisposable
{
    private readonly TempIndex dir = new();

    [Fact]
    public void Merge_with_json_reports_what_it_did_and_exits_0()
    {
        string one = Write(Part(1), Photos(0, 30));
        string two = Write(Part(2), [.. Photos(30, 30), Failed(99, Day1)]);

        var (exitCode, output, error) = Run("merge", one, two, "--index", dir.Path, "--json", "--quiet");

        Assert.Equal(0, exitCode);
        Assert.Equal("", error);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.Equal(2, root.GetProperty("parts").GetInt32());
        Assert.Equal(61, root.GetProperty("added").GetInt32());
        Assert.Equal(60, root.GetProperty("indexedTotal").GetInt32());
        Assert.True(root.GetProperty("bulkBuild").GetBoolean());
        Assert.Equal(1, root.GetProperty("failed").GetInt32());
        Assert.Equal(PathOf(99), root.GetProperty("failures")[0].GetProperty("path").GetString());
    }

    [Fact]
    public void Merge_prints_a_table_and_a_second_run_finds_everything_unchanged()
    {
        string one = Write(Part(1), Photos(0, 30));
        Run("merge", one, "--index", dir.Path, "--quiet");

        var (exitCode, output, _) = Run("merge", one, "--index", dir.Path, "--quiet");

        Assert.Equal(0, exitCode);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Matches(@"^parts\s+read\s+added\s+replaced\s+updated\s+unchanged\s+superseded\s+failed\s+time$", lines[0]);
        Assert.Matches(@"^-[- ]+$", lines[1]);
        Assert.Matches(@"^\s+1\s+30\s+0\s+0\s+0\s+30\s+0\s+0\s+\S+$", lines[2]);
        Assert.Contains("30 photos indexed (no vectors inserted)", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Merge_without_quiet_reports_its_stages_on_stderr_and_keeps_stdout_for_the_summary()
    {
        string one = Write(Part(1), Photos(0, 30));

        var (exitCode, output, error) = Run("merge", one, "--index", dir.Path, "--json");

        Assert.Equal(0, exitCode);
        Assert.Contains("reading 1/1", error, StringComparison.Ordinal);
        Assert.Contains("writing 30/30", error, StringComparison.Ordinal);
        Assert.Equal(30, JsonDocument.Parse(output).RootElement.GetProperty("added").GetInt32());
    }

    [Fact]
    public void A_refused_part_exits_1_naming_it_on_stderr_without_a_stack_trace()
    {
        string one = Write(Part(1), Photos(0, 3));
        string other = Write(Part(2), Photos(3, 3), new PartBasis { SkuMapping = "csv:/srv/skus.csv" });

        var (exitCode, output, error) = Run("merge", one, other, "--index", dir.Path, "--quiet");

        Assert.Equal(1, exitCode);
        Assert.Equal("", output);
        Assert.StartsWith($"lookup merge: {other} maps SKUs by 'csv:/srv/skus.csv'", error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Merge_without_parts_or_without_an_index_is_a_usage_error()
    {
        Assert.Equal(2, Run("merge", "--index", dir.Path).ExitCode);
        Assert.Equal(2, Run("merge", Part(1)).ExitCode);
    }

    public void Dispose() => dir.Dispose();

    private string Part(int k) => Path.Combine(dir.Directory, $"part-{k}.lookup");

    private static (int ExitCode, string Output, string Error) Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        int exitCode = Program.Run(args, new InvocationConfiguration { Output = output, Error = error });
        return (exitCode, output.ToString(), error.ToString());
    }
}

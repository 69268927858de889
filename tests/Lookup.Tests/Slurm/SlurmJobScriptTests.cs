namespace Lookup.Tests.Slurm;

/// <summary>
/// The job scripts in tools/slurm/ run outside Slurm with the variables Slurm would set and a stand-in for lookup
/// that records its arguments and answers as told: the shard arithmetic, the exit-status rules and the merge's
/// check for missing parts, in milliseconds. (The real thing under Slurm: <see cref="SlurmShardedIngestTests"/>.)
/// </summary>
public sealed class SlurmJobScriptTests : IDisposable
{
    private readonly string work = Path.Combine(Path.GetTempPath(), "lookup-jobscripts-" + Guid.NewGuid().ToString("N")[..12]);

    public SlurmJobScriptTests() => Directory.CreateDirectory(Path.Combine(work, "parts"));

    [Fact]
    public void An_array_task_ingests_shard_k_of_the_submitted_n_with_a_worker_per_cpu()
    {
        var (exitCode, _) = RunShard(task: "2", arrayCount: "1", answer: "exit 0");

        Assert.Equal(0, exitCode);
        string args = File.ReadAllText(Path.Combine(work, "args"));
        Assert.Contains("ingest /srv/photos --index " + Path.Combine(work, "parts", "part-2.lookup"), args, StringComparison.Ordinal);
        Assert.Contains("--shard 2/5 --workers 4 --sku-from folder --json", args, StringComparison.Ordinal);
    }

    [Fact]
    public void A_shard_whose_only_problem_is_failed_photos_succeeds_so_the_merge_can_run()
    {
        var (exitCode, error) = RunShard(task: "3", arrayCount: "5", answer: "echo '{ \"indexedTotal\": 40, \"failed\": 2 }'; exit 1");

        Assert.Equal(0, exitCode);
        Assert.Contains("some photos failed", error, StringComparison.Ordinal);
    }

    [Fact]
    public void A_shard_that_could_not_run_fails_with_lookups_status()
    {
        var (exitCode, _) = RunShard(task: "3", arrayCount: "5", answer: "echo 'index is locked' >&2; exit 1");
        var (interrupted, _) = RunShard(task: "3", arrayCount: "5", answer: "exit 130");

        Assert.Equal(1, exitCode);
        Assert.Equal(130, interrupted);
    }

    [Fact]
    public void The_merge_job_names_the_shards_without_a_part_and_does_not_run_lookup()
    {
        File.WriteAllBytes(Path.Combine(work, "parts", "part-1.lookup"), []);
        File.WriteAllBytes(Path.Combine(work, "parts", "part-3.lookup"), []);

        var (exitCode, _, error) = ShellCommand.Run("bash", [Script("merge-parts.sbatch")], Environment("exit 0", ("LOOKUP_SHARDS", "4")));

        Assert.Equal(1, exitCode);
        Assert.Contains("no part file for shard(s) 2 4 of 4", error, StringComparison.Ordinal);
        Assert.Contains("--only 2,4", error, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(work, "args")));
    }

    [Fact]
    public void The_merge_job_merges_parts_1_to_n_in_order()
    {
        for (int k = 1; k <= 3; k++)
        {
            File.WriteAllBytes(Path.Combine(work, "parts", $"part-{k}.lookup"), []);
        }

        var (exitCode, _, _) = ShellCommand.Run("bash", [Script("merge-parts.sbatch")], Environment("exit 0", ("LOOKUP_SHARDS", "3")));

        Assert.Equal(0, exitCode);
        string parts = Path.Combine(work, "parts");
        Assert.Equal(
            $"merge {parts}/part-1.lookup {parts}/part-2.lookup {parts}/part-3.lookup --index {work}/merged.lookup --json",
            File.ReadAllText(Path.Combine(work, "args")).Trim());
    }

    [Theory]
    [InlineData("--shards 0", "--shards must be a whole number")]
    [InlineData("--shards 5 --only 7", "shard 7 is not between 1 and 5")]
    [InlineData("--shards 5 --only 2-4", "--only takes shard numbers separated by commas")]
    [InlineData("--shards 5 --cpus two", "--cpus must be a whole number")]
    public void Submit_refuses_bad_options_before_submitting_anything(string options, string message)
    {
        string sbatch = Path.Combine(work, "sbatch");
        File.WriteAllText(sbatch, $"#!/bin/sh\ntouch '{work}/sbatch-called'\nexit 99\n");
        ShellCommand.Run("chmod", ["+x", sbatch]);

        var (exitCode, _, error) = ShellCommand.Run(
            "bash", [Script("submit.sh"), "--tree", work, "--index", Path.Combine(work, "merged.lookup"), .. options.Split(' ')],
            new Dictionary<string, string> { ["PATH"] = $"{work}:{System.Environment.GetEnvironmentVariable("PATH")}" });

        Assert.Equal(2, exitCode);
        Assert.Contains(message, error, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(work, "sbatch-called")));
    }

    public void Dispose() => Directory.Delete(work, recursive: true);

    private (int ExitCode, string Error) RunShard(string task, string arrayCount, string answer)
    {
        var (exitCode, _, error) = ShellCommand.Run("bash", [Script("ingest-shard.sbatch")], Environment(
            answer,
            ("SLURM_ARRAY_TASK_ID", task),
            ("SLURM_ARRAY_TASK_COUNT", arrayCount),
            ("SLURM_CPUS_PER_TASK", "4"),
            ("LOOKUP_SHARDS", "5")));
        return (exitCode, error);
    }

    /// <summary>The variables submit.sh exports, with LOOKUP_CMD pointing at a stand-in that records its arguments
    /// in WORK/args and then runs <paramref name="answer"/>.</summary>
    private Dictionary<string, string> Environment(string answer, params (string Name, string Value)[] more)
    {
        string fake = Path.Combine(work, "fake-lookup.sh");
        File.WriteAllText(fake, $"#!/usr/bin/env bash\necho \"$*\" > '{Path.Combine(work, "args")}'\n{answer}\n");
        var environment = new Dictionary<string, string>
        {
            ["LOOKUP_CMD"] = "bash " + fake,
            ["LOOKUP_TREE"] = "/srv/photos",
            ["LOOKUP_PARTS"] = Path.Combine(work, "parts"),
            ["LOOKUP_INDEX"] = Path.Combine(work, "merged.lookup"),
        };
        foreach (var (name, value) in more)
        {
            environment[name] = value;
        }

        return environment;
    }

    private static string Script(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            string candidate = Path.Combine(dir.FullName, "tools", "slurm", name);
            if (File.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new FileNotFoundException($"tools/slurm/{name} not found above {AppContext.BaseDirectory}.");
    }
}

using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using Lookup.Catalogue;
using Lookup.Cli;
using Lookup.Tests.Catalogue;
using Lookup.Tests.Imaging;

namespace Lookup.Tests.Slurm;

/// <summary>
/// The sharded ingest as a site would run it: a real single-node Slurm cluster (Debian's munge, slurmctld, slurmd,
/// slurm-client, configured from tools/slurm/local-cluster), tools/slurm/submit.sh submitting a job array of three
/// ingest shards of the open reference photos (opencv-doc and scikit-image samples in tests/reference-data, one
/// SKU folder per photo, plus an empty file and scikit-image's own truncated JPEG) and the merge job after it,
/// each running the built lookup CLI. The merged index must hold exactly the photos of a single-process ingest of
/// the same tree, with the same vectors and nearest photos.
/// </summary>
public sealed partial class SlurmShardedIngestTests : IDisposable
{
    private const int Shards = 3;
    private static readonly TimeSpan JobLimit = TimeSpan.FromMinutes(10);

    private readonly string work = Path.Combine(Path.GetTempPath(), "lookup-slurm-" + Guid.NewGuid().ToString("N")[..12]);

    [SlurmFact]
    public void A_job_array_of_shards_and_a_dependent_merge_give_the_index_a_single_ingest_gives()
    {
        string repository = RepositoryRoot();
        string catalogue = BuildCatalogue(Path.Combine(work, "catalogue"));
        string merged = Path.Combine(work, "merged.lookup");
        string parts = Path.Combine(work, "parts");
        var cli = CliCommand();

        using var cluster = LocalSlurmCluster.Start(repository, Path.Combine(work, "cluster"));
        var environment = new Dictionary<string, string>(cluster.Environment) { ["LOOKUP_CMD"] = string.Join(' ', cli) };
        var (arrayJob, mergeJob) = Submit(repository, environment, catalogue, merged, parts);

        // The single-process ingest runs while the cluster works: same total CPU, less waiting.
        string single = Path.Combine(work, "single.lookup");
        var ingest = ShellCommand.Run(cli[0], [.. cli.Skip(1), "ingest", catalogue, "--index", single, "--workers", "2", "--quiet"], limit: JobLimit);
        Assert.True(ingest.ExitCode == 1, $"single ingest exited {ingest.ExitCode} (1 expected: two photos are broken):\n{ingest.Output}\n{ingest.Error}");
        WaitFor(mergeJob, cluster, parts);

        AssertTasksCompleted(arrayJob, Shards, cluster, parts);
        for (int k = 1; k <= Shards; k++)
        {
            var records = MergeTestParts.Read(Path.Combine(parts, $"part-{k}.lookup")).Records;
            Assert.All(records.Keys, path => Assert.Equal(k, ShardSpec.Of(path, Shards)));
        }

        using (var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(parts, "logs", "merge.json"))))
        {
            Assert.True(summary.RootElement.GetProperty("bulkBuild").GetBoolean());
            Assert.Equal(2, summary.RootElement.GetProperty("failed").GetInt32());
        }

        var (expected, expectedGraph) = MergeTestParts.Read(single);
        var (actual, actualGraph) = MergeTestParts.Read(merged);
        int files = Directory.GetFiles(catalogue, "*", SearchOption.AllDirectories).Length;
        Assert.Equal(files, expected.Count);
        ShardIngestTests.AssertSameCatalogue(expected, expectedGraph!, actual, actualGraph!);

        // A rerun of one shard is that array index alone, with N still 3; its unchanged part merges as a no-op.
        var (rerunJob, rerunMerge) = Submit(repository, environment, catalogue, merged, parts, "--only", "2");
        WaitFor(rerunMerge, cluster, parts);
        AssertTasksCompleted(rerunJob, 1, cluster, parts);
        using var rerun = JsonDocument.Parse(File.ReadAllText(Path.Combine(parts, "logs", "part-2.json")));
        Assert.Equal(0, rerun.RootElement.GetProperty("new").GetInt32());
        Assert.Equal(MergeTestParts.Read(Path.Combine(parts, "part-2.lookup")).Records.Count, rerun.RootElement.GetProperty("unchanged").GetInt32());
        using var remerge = JsonDocument.Parse(File.ReadAllText(Path.Combine(parts, "logs", "merge.json")));
        Assert.Equal(0, remerge.RootElement.GetProperty("added").GetInt32() + remerge.RootElement.GetProperty("replaced").GetInt32());
        Assert.Equal(files, remerge.RootElement.GetProperty("unchanged").GetInt32());

        // The same parts merged again through the command in this process: nothing changes.
        var again = RunLookup(["merge", .. Enumerable.Range(1, Shards).Select(k => Path.Combine(parts, $"part-{k}.lookup")), "--index", merged, "--json", "--quiet"]);
        Assert.Equal(0, again.ExitCode);
        Assert.Equal(files, JsonDocument.Parse(again.Output).RootElement.GetProperty("unchanged").GetInt32());
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(work, recursive: true);
        }
        catch (IOException)
        {
            // A daemon still closing a log file; the temp folder is cleaned by the system.
        }
    }

    /// <summary>Every opencv-doc and scikit-image reference photo in a SKU folder of its own, and an empty file.</summary>
    private static string BuildCatalogue(string root)
    {
        foreach (string source in new[] { "opencv", "skimage" })
        {
            foreach (string photo in Directory.GetFiles(Path.Combine(ReferenceData.Root, source)))
            {
                string folder = Path.Combine(root, $"{source}-{Path.GetFileNameWithoutExtension(photo)}");
                Directory.CreateDirectory(folder);
                File.Copy(photo, Path.Combine(folder, Path.GetFileName(photo)));
            }
        }

        Directory.CreateDirectory(Path.Combine(root, "broken-empty"));
        File.WriteAllBytes(Path.Combine(root, "broken-empty", "empty.jpg"), []);
        return root;
    }

    private static (string ArrayJob, string MergeJob) Submit(
        string repository, Dictionary<string, string> environment, string catalogue, string merged, string parts, params string[] more)
    {
        string script = Path.Combine(repository, "tools", "slurm", "submit.sh");
        var (exitCode, output, error) = ShellCommand.Run(
            "bash",
            [script, "--tree", catalogue, "--index", merged, "--parts", parts, "--shards", Shards.ToString(CultureInfo.InvariantCulture), "--cpus", "1", .. more],
            environment);
        Assert.True(exitCode == 0, $"submit.sh exited {exitCode}: {error}");
        return (JobId(output, "array"), JobId(output, "merge"));
    }

    private static string JobId(string submitOutput, string name) =>
        Regex.Match(submitOutput, $"^{name}=([0-9]+)$", RegexOptions.Multiline) is { Success: true } match
            ? match.Groups[1].Value
            : throw new InvalidOperationException($"submit.sh printed no {name}= line: {submitOutput}");

    /// <summary>Polls scontrol (there is no accounting database for sacct) until the job ends; it must complete.</summary>
    private static void WaitFor(string job, LocalSlurmCluster cluster, string parts)
    {
        var deadline = DateTime.UtcNow + JobLimit;
        string state = "";
        while (DateTime.UtcNow < deadline)
        {
            state = JobStates(job, cluster).FirstOrDefault() ?? "";
            if (state is not ("" or "PENDING" or "CONFIGURING" or "RUNNING" or "COMPLETING"))
            {
                break;
            }

            Thread.Sleep(1_000);
        }

        Assert.True(state == "COMPLETED", $"job {job} ended as '{state}' (or not within {JobLimit}).\n{JobLogs(parts)}\n{cluster.Logs()}");
    }

    private static void AssertTasksCompleted(string arrayJob, int tasks, LocalSlurmCluster cluster, string parts)
    {
        var states = JobStates(arrayJob, cluster);
        Assert.True(states.Count == tasks && states.All(s => s == "COMPLETED"), $"array job {arrayJob}: {string.Join(", ", states)}\n{JobLogs(parts)}");
    }

    private static List<string> JobStates(string job, LocalSlurmCluster cluster)
    {
        var (_, output, _) = ShellCommand.Run("scontrol", ["show", "job", job], cluster.Environment);
        return [.. StateField().Matches(output).Select(m => m.Groups[1].Value)];
    }

    private static string JobLogs(string parts)
    {
        var text = new StringBuilder();
        string logs = Path.Combine(parts, "logs");
        var files = Directory.Exists(logs) ? Directory.GetFiles(logs, "*.out") : [];
        foreach (string file in files.Order(StringComparer.Ordinal))
        {
            text.AppendLine(CultureInfo.InvariantCulture, $"== {file}").AppendLine(File.ReadAllText(file));
        }

        return text.ToString();
    }

    /// <summary>The built CLI beside the tests (the test project references Lookup.Cli, so its dll, runtimeconfig and
    /// model files are in this output folder), run by the dotnet host that runs the tests.</summary>
    private static string[] CliCommand()
    {
        string dll = Path.Combine(AppContext.BaseDirectory, "Lookup.Cli.dll");
        Assert.True(File.Exists(dll), $"{dll} is missing: build the solution (tools/test.sh builds it).");
        string dotnet = System.Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host ? host : "dotnet";
        Assert.False(dll.Contains(' ', StringComparison.Ordinal) || dotnet.Contains(' ', StringComparison.Ordinal),
            $"the job scripts split LOOKUP_CMD on spaces; run the tests from a path without spaces ({dotnet} {dll}).");
        return [dotnet, dll];
    }

    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "tools", "slurm", "submit.sh")))
            {
                return dir.FullName;
            }
        }

        throw new DirectoryNotFoundException($"tools/slurm/submit.sh not found above {AppContext.BaseDirectory}.");
    }

    private static (int ExitCode, string Output) RunLookup(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        int exitCode = Program.Run(args, new InvocationConfiguration { Output = output, Error = error });
        return (exitCode, output.ToString());
    }

    [GeneratedRegex(@"JobState=([A-Z_]+)")]
    private static partial Regex StateField();
}

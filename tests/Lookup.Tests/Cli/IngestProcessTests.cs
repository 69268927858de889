using System.Diagnostics;
using System.Text.Json;
using Lookup.Store;
using Lookup.Tests.Catalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// The real <c>lookup ingest</c> in a child process, stopped the hard way (SIGKILL) and the polite way (SIGINT),
/// refused by a second writer, and refused read access by the operating system. Photos: open reference photos
/// (tests/reference-data, see SOURCES.md), one writer transaction per photo so a stop lands between commits.
/// </summary>
public sealed class IngestProcessTests : IDisposable
{
    private const int Photos = 12;
    private static readonly TimeSpan PollLimit = TimeSpan.FromMinutes(2);

    private readonly IngestTree tree = new();

    public IngestProcessTests()
    {
        for (int i = 0; i < Photos; i++)
        {
            string reference = IngestTree.Distinct[i];
            tree.Add($"S-{i % 4}/{i:00}{Path.GetExtension(reference)}", reference);
        }
    }

    [Fact]
    public void A_writer_killed_mid_run_twice_leaves_an_index_that_a_rerun_completes_with_every_photo_once()
    {
        int committed = 0;
        for (int round = 1; round <= 2; round++)
        {
            using var child = StartIngest();
            committed = WaitForCommitted(child, committed + 1);
            child.KillHard();
            child.WaitForExit();

            var killed = IndexSnapshot.Read(tree.IndexPath);
            Assert.InRange(killed.Records.Count, committed, Photos - 1);
            AssertConsistent(killed);
            committed = killed.Records.Count;
        }

        var (exitCode, output, error) = LookupProcess.Run(IngestArgs());

        Assert.True(exitCode == 0, $"exit code {exitCode}: {error}");
        using var json = JsonDocument.Parse(output);
        Assert.Equal(Photos - committed, json.RootElement.GetProperty("embedded").GetInt32());
        Assert.Equal(committed, json.RootElement.GetProperty("unchanged").GetInt32());
        var index = IndexSnapshot.Read(tree.IndexPath);
        Assert.Equal(Photos, index.Indexed.Count());
        AssertConsistent(index);
    }

    [Fact]
    public void Ctrl_c_stops_after_committing_the_photos_done_exits_130_and_a_rerun_finishes()
    {
        using var child = StartIngest();
        int committed = WaitForCommitted(child, 1);
        // A shell that starts a job in the background gives it SIGINT ignored, and the operating system then
        // never delivers Ctrl+C; SIGTERM takes the same path through the command.
        string signal = child.IgnoresInterrupt() ? "TERM" : "INT";

        child.Signal(signal);
        int exitCode = child.WaitForExit();

        Assert.True(exitCode == 130, $"SIG{signal} gave exit code {exitCode}: {child.Error}");
        using var stopped = JsonDocument.Parse(child.Output);
        Assert.True(stopped.RootElement.GetProperty("cancelled").GetBoolean());
        int embedded = stopped.RootElement.GetProperty("embedded").GetInt32();
        var index = IndexSnapshot.Read(tree.IndexPath);
        Assert.InRange(embedded, committed, Photos - 1);
        Assert.Equal(embedded, index.Indexed.Count());
        AssertConsistent(index);

        var (rerunExit, output, _) = LookupProcess.Run(IngestArgs());

        Assert.Equal(0, rerunExit);
        using var finished = JsonDocument.Parse(output);
        Assert.Equal(Photos - embedded, finished.RootElement.GetProperty("embedded").GetInt32());
        var complete = IndexSnapshot.Read(tree.IndexPath);
        Assert.Equal(Photos, complete.Indexed.Count());
        AssertConsistent(complete);
    }

    [Fact]
    public void A_second_writer_is_refused_with_a_message_naming_the_holder()
    {
        using var holder = IndexFile.Open(tree.IndexPath, IndexAccess.Write);

        var (exitCode, _, error) = LookupProcess.Run(IngestArgs());

        Assert.Equal(1, exitCode);
        Assert.Contains($"{tree.IndexPath} is being written by pid {Environment.ProcessId} on {Environment.MachineName}", error, StringComparison.Ordinal);
    }

    [Fact]
    public void A_photo_without_read_permission_is_recorded_as_access_denied_when_the_system_refuses_it()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        string locked = tree.PathOf("S-0/00.jpg");
        File.SetUnixFileMode(locked, UnixFileMode.None);
        // Root reads a mode-000 file anyway. Dropping CAP_DAC_OVERRIDE and CAP_DAC_READ_SEARCH from the child's
        // bounding set (setpriv, util-linux) makes root obey file modes like any user; where that is not possible
        // the test checks what an unrestricted root gets instead.
        string[]? wrapper = Environment.UserName == "root" ? ["setpriv", "--bounding-set=-dac_override,-dac_read_search"] : null;
        bool refused = IsRefused(locked, wrapper);
        wrapper = refused ? wrapper : null;

        var (exitCode, output, error) = LookupProcess.Run(IngestArgs(), wrapper);

        var index = IndexSnapshot.Read(tree.IndexPath);
        using var json = JsonDocument.Parse(output);
        if (refused)
        {
            Assert.True(exitCode == 1, $"exit code {exitCode}: {error}");
            var failure = Assert.Single(json.RootElement.GetProperty("failures").EnumerateArray());
            Assert.Equal("S-0/00.jpg", failure.GetProperty("path").GetString());
            Assert.Equal("AccessDenied", failure.GetProperty("reason").GetString());
            Assert.Contains(locked, failure.GetProperty("message").GetString(), StringComparison.Ordinal);
            Assert.Equal("AccessDenied", index.Records["S-0/00.jpg"].FailureReason);
            Assert.Equal(Photos - 1, index.Indexed.Count());
        }
        else
        {
            Assert.Equal(0, exitCode);
            Assert.Equal(Photos, index.Indexed.Count());
        }
    }

    public void Dispose() => tree.Dispose();

    private string[] IngestArgs() =>
        ["ingest", tree.Root, "--index", tree.IndexPath, "--json", "--quiet", "--workers", "1", "--batch-size", "1"];

    private LookupProcess StartIngest() => LookupProcess.Start(IngestArgs());

    /// <summary>Polls the index through read-only snapshots until at least <paramref name="atLeast"/> photos are committed.</summary>
    private int WaitForCommitted(LookupProcess child, int atLeast)
    {
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed < PollLimit)
        {
            Assert.False(child.HasExited, $"lookup exited before {atLeast} photos were committed: {child.Error}");
            int count = CommittedPhotos();
            if (count >= atLeast)
            {
                return count;
            }

            Thread.Sleep(20);
        }

        throw new TimeoutException($"fewer than {atLeast} photos committed after {PollLimit}");
    }

    private int CommittedPhotos()
    {
        try
        {
            using var file = IndexFile.Open(tree.IndexPath, IndexAccess.Read);
            return new PhotoTable(file).Count;
        }
        catch (IndexFileException)
        {
            return 0; // not created yet, or still shorter than one page
        }
    }

    /// <summary>
    /// Every indexed photo owns exactly one live node and no live node is left without a photo; each node's own
    /// vector finds that node first; the graph passes its integrity check.
    /// </summary>
    private static void AssertConsistent(IndexSnapshot index)
    {
        var graph = index.Graph!;
        var indexed = index.Indexed.ToList();
        Assert.All(index.Records.Values, r => Assert.Equal(PhotoStatus.Indexed, r.Status));
        var nodes = indexed.Select(r => r.NodeId!.Value).ToList();
        Assert.Equal(nodes.Count, nodes.Distinct().Count());
        Assert.Equal(indexed.Count, graph.LiveCount);
        Assert.All(nodes, n => Assert.False(graph.IsDeleted(n)));
        foreach (var record in indexed)
        {
            var hit = graph.Search(graph.GetVector(record.NodeId!.Value), 1).Single();
            Assert.Equal(record.Path, index.ByNode(hit.Id)?.Path);
        }

        var report = graph.CheckIntegrity();
        Assert.True(report.IsHealthy, report.ToString());
    }

    private static bool IsRefused(string path, string[]? wrapper)
    {
        if (wrapper is null)
        {
            try
            {
                File.ReadAllBytes(path);
                return false;
            }
            catch (UnauthorizedAccessException)
            {
                return true;
            }
        }

        var probe = new ProcessStartInfo(wrapper[0]) { RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var arg in wrapper.Skip(1).Concat(["head", "-c", "1", path]))
        {
            probe.ArgumentList.Add(arg);
        }

        try
        {
            using var process = Process.Start(probe)!;
            process.WaitForExit();
            return process.ExitCode != 0 && process.StandardError.ReadToEnd().Contains("Permission denied", StringComparison.Ordinal);
        }
        catch (System.ComponentModel.Win32Exception)
        {
            return false; // no setpriv here
        }
    }
}

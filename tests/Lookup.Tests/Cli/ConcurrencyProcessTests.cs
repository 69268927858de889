using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using Lookup.Store;
using Lookup.Tests.Catalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// Several real <c>lookup</c> processes on one index: readers (match, sweep, check) and a second writer while an
/// ingest is part-way through writing, and many matches at once. Photos: open reference photos (see SOURCES.md).
/// </summary>
[Collection(IngestedTemplateCollection.Name)]
public sealed class ConcurrencyProcessTests(IngestedTemplate template)
{
    private static readonly TimeSpan PollLimit = TimeSpan.FromMinutes(2);

    [Fact]
    public void Match_sweep_and_check_answer_from_a_snapshot_while_an_ingest_writes_and_a_second_ingest_is_refused_naming_it()
    {
        string index = Path.Combine(Path.GetDirectoryName(template.CopyOfIndex())!, "growing.lookup");
        string[] ingestArgs = ["ingest", template.Root, "--index", index, "--json", "--quiet", "--workers", "1", "--batch-size", "1"];
        using var writer = LookupProcess.Start(ingestArgs);
        int committed = WaitForCommitted(writer, index, 3);
        // SIGSTOP holds the writer part-way through its run (lock held, journal open, photos still to embed), so the
        // readers below are certain to meet a live writer however fast this machine is; SIGCONT lets it finish.
        writer.Signal("STOP");
        try
        {
            using var match = LookupProcess.Start(["match", template.Photo(0), "--index", index, "--json", "--crops", "none"]);
            using var sweep = LookupProcess.Start(["sweep", "--index", index, "--json", "--quiet"]);
            using var check = LookupProcess.Start(["check", "--index", index, "--json"]);
            using var second = LookupProcess.Start(ingestArgs);

            Assert.True(match.WaitForExit() == 0, match.Error);
            using (var answer = JsonDocument.Parse(match.Output))
            {
                // Photos are committed in path order, so S-0/00 is among the first three.
                Assert.Equal("S-0", answer.RootElement.GetProperty("answers")[0].GetProperty("sku").GetString());
            }

            int sweepExit = sweep.WaitForExit();
            Assert.True(sweepExit is 0 or 3, $"sweep exit code {sweepExit}: {sweep.Error}");
            using (var swept = JsonDocument.Parse(sweep.Output))
            {
                int photos = swept.RootElement.GetProperty("report").GetProperty("counts").GetProperty("photos").GetInt32();
                Assert.InRange(photos, committed, IngestedTemplate.Photos - 1);
            }

            Assert.Contains($"is being written by pid {writer.Id}", sweep.Error, StringComparison.Ordinal);
            Assert.True(check.WaitForExit() == 0, check.Output + check.Error);
            Assert.Equal(1, second.WaitForExit());
            Assert.StartsWith($"lookup ingest: {Path.GetFullPath(index)} is being written by pid {writer.Id} on {Environment.MachineName}", second.Error, StringComparison.Ordinal);
            Assert.Contains("ingest", second.Error, StringComparison.Ordinal);
        }
        finally
        {
            writer.Signal("CONT");
        }

        Assert.True(writer.WaitForExit() == 0, writer.Error);
        var snapshot = IndexSnapshot.Read(index);
        Assert.Equal(IngestedTemplate.Photos, snapshot.Indexed.Count());
        Assert.Equal(IngestedTemplate.Photos, snapshot.Graph!.LiveCount);
        using var file = IndexFile.Open(index, IndexAccess.Read);
        Assert.Empty(IndexChecker.Check(file, verifyModelFiles: false).Findings);
    }

    [Fact]
    public void Six_matches_at_once_on_one_index_all_succeed_with_identical_answers()
    {
        string index = template.CopyOfIndex();
        string[] args = ["match", template.Photo(0), template.Photo(5), "--each", "--crops", "none", "--index", index, "--json", "--workers", "1"];
        var processes = Enumerable.Range(0, 6).Select(_ => LookupProcess.Start(args)).ToList();
        try
        {
            var results = processes.Select(p => (ExitCode: p.WaitForExit(), p.Output, p.Error)).ToList();

            Assert.All(results, r => Assert.True(r.ExitCode == 0, r.Error));
            Assert.Single(results.Select(r => r.Output).Distinct());
            using var answer = JsonDocument.Parse(results[0].Output);
            Assert.Equal(
                ["S-0", "S-1"],
                answer.RootElement.GetProperty("answers").EnumerateArray().Select(a => a.GetProperty("sku").GetString()));
        }
        finally
        {
            processes.ForEach(p => p.Dispose());
        }
    }

    private static int WaitForCommitted(LookupProcess child, string index, int atLeast)
    {
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed < PollLimit)
        {
            Assert.False(child.HasExited, string.Create(CultureInfo.InvariantCulture, $"lookup exited before {atLeast} photos were committed: {child.Error}"));
            try
            {
                using var file = IndexFile.Open(index, IndexAccess.Read);
                int count = new PhotoTable(file).Count;
                if (count >= atLeast)
                {
                    return count;
                }
            }
            catch (IndexFileException)
            {
                // Not created yet, or shorter than one page.
            }

            Thread.Sleep(20);
        }

        throw new TimeoutException($"fewer than {atLeast} photos committed after {PollLimit}");
    }
}

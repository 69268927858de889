using System.Diagnostics;
using System.IO.Compression;
using System.Security.Cryptography;
using System.Text.Json;
using LiteDB;
using Lookup.Store;
using Lookup.Tests.Catalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// Storage faults met by the real <c>lookup</c> executable: damaged and foreign index files, a read-only index, a
/// write refused by the kernel part-way through an ingest, and SIGKILL at several points of an ingest and of a sweep.
/// In every case: a one-paragraph message and exit code 1 (never a stack trace), nothing already committed is lost,
/// and the next run completes with every photo exactly once (the index check finds no error).
/// </summary>
[Collection(IngestedTemplateCollection.Name)]
public sealed class IndexFaultProcessTests(IngestedTemplate template)
{
    private static readonly TimeSpan PollLimit = TimeSpan.FromMinutes(2);

    [Theory]
    [InlineData("text", "status", "shorter than one LiteDB page (8192): it is truncated or not an index")]
    [InlineData("zip", "check", "is not a Lookup index (no LiteDB header)")]
    [InlineData("zip", "ingest", "is not a Lookup index (no LiteDB header)")]
    [InlineData("other-litedb", "status", "is a LiteDB file but not a Lookup index (no schema record)")]
    [InlineData("other-litedb", "ingest", "is a LiteDB file but not a Lookup index (no schema record)")]
    [InlineData("newer-schema", "ingest", "uses index schema 99; this Lookup reads schema 1 and older. Update Lookup to open it.")]
    [InlineData("newer-schema", "sweep", "uses index schema 99; this Lookup reads schema 1 and older. Update Lookup to open it.")]
    [InlineData("header-only", "match", "shorter than one LiteDB page (8192)")]
    [InlineData("cut-in-half", "status", "is truncated: it is ")]
    [InlineData("cut-in-half", "check", "is truncated: it is ")]
    [InlineData("cut-in-half", "match", "is truncated: it is ")]
    [InlineData("cut-in-half", "sweep", "is truncated: it is ")]
    [InlineData("cut-in-half", "ingest", "is truncated: it is ")]
    [InlineData("overwritten-pages", "status", "damaged")]
    [InlineData("overwritten-pages", "sweep", "damaged")]
    public void A_damaged_or_foreign_index_gets_a_clear_message_and_exit_1_never_a_stack_trace_and_is_left_untouched(string kind, string command, string expected)
    {
        string index = MakeIndex(kind);
        byte[] before = File.ReadAllBytes(index);

        var (exitCode, output, error) = LookupProcess.Run(Command(command, index));

        Assert.True(exitCode == 1, $"exit code {exitCode}\nstdout: {output}\nstderr: {error}");
        Assert.StartsWith($"lookup {command}: ", error, StringComparison.Ordinal);
        Assert.Contains(expected, error, StringComparison.Ordinal);
        AssertNoStackTrace(error);
        Assert.Equal(SHA256.HashData(before), SHA256.HashData(File.ReadAllBytes(index)));
    }

    [Fact]
    public void A_read_only_index_answers_match_status_check_and_sweep_and_ingest_refuses_saying_why()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        string index = template.CopyOfIndex();
        string folder = Path.GetDirectoryName(index)!;
        byte[] before = File.ReadAllBytes(index);
        File.SetUnixFileMode(index, UnixFileMode.UserRead | UnixFileMode.GroupRead | UnixFileMode.OtherRead);
        File.SetUnixFileMode(folder, UnixFileMode.UserRead | UnixFileMode.UserExecute | UnixFileMode.GroupRead | UnixFileMode.GroupExecute | UnixFileMode.OtherRead | UnixFileMode.OtherExecute);
        // Root ignores file modes; without CAP_DAC_OVERRIDE (setpriv, util-linux) it obeys them like any user.
        string[]? wrapper = Environment.UserName == "root" ? ["setpriv", "--bounding-set=-dac_override,-dac_read_search"] : null;
        bool enforced = Refuses(wrapper, Path.Combine(folder, "probe"));

        var status = LookupProcess.Run(["status", "--index", index], wrapper);
        var check = LookupProcess.Run(["check", "--index", index], wrapper);
        var match = LookupProcess.Run(["match", template.Photo(0), "--index", index, "--json"], wrapper);
        var sweep = LookupProcess.Run(["sweep", "--index", index, "--json", "--quiet"], wrapper);
        var ingest = LookupProcess.Run(["ingest", template.Root, "--index", index, "--json", "--quiet"], wrapper);

        Assert.True(status.ExitCode == 0, status.Error);
        Assert.True(check.ExitCode == 0, check.Output + check.Error);
        Assert.True(match.ExitCode == 0, match.Error);
        using (var answer = JsonDocument.Parse(match.Output))
        {
            Assert.Equal("S-0", answer.RootElement.GetProperty("answers")[0].GetProperty("sku").GetString());
        }

        Assert.True(sweep.ExitCode is 0 or 3, $"sweep exit code {sweep.ExitCode}: {sweep.Error}");
        Assert.Equal(before, File.ReadAllBytes(index));
        if (enforced)
        {
            Assert.Contains("was reported but not stored", sweep.Error, StringComparison.Ordinal);
            Assert.Equal(1, ingest.ExitCode);
            Assert.StartsWith($"lookup ingest: {index} cannot be written: access to {index}.lock was denied", ingest.Error, StringComparison.Ordinal);
            Assert.Contains("match, status and check only read", ingest.Error, StringComparison.Ordinal);
            AssertNoStackTrace(ingest.Error + sweep.Error + status.Error + check.Error + match.Error);
        }
        else
        {
            Assert.Equal(0, ingest.ExitCode);
        }
    }

    [Theory]
    [InlineData("full-disk", "No space left on device")]
    [InlineData("file-size-limit", "Specified file length was too large for the file system")]
    public void A_write_the_kernel_refuses_mid_ingest_is_reported_plainly_keeps_every_committed_batch_and_the_rerun_finishes(string fault, string reason)
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        string folder = Path.GetDirectoryName(template.CopyOfIndex())!;
        string index = Path.Combine(folder, "fresh.lookup");
        if (fault == "full-disk")
        {
            var probe = Shell(["unshare", "--user", "--map-root-user", "--mount", "true"]);
            Assert.True(probe.ExitCode == 0,
                $"the full-disk case mounts a small tmpfs in a private user and mount namespace, which this system refuses ({probe.Error.Trim()}); " +
                "allow unprivileged user namespaces (sysctl kernel.unprivileged_userns_clone=1, or a container runtime profile that permits unshare).");
        }

        string[] wrapper = fault == "full-disk"
            // A tmpfs of StorageLimit bytes mounted over the index's folder in a private user and mount namespace
            // (unshare, util-linux; no real root needed): the kernel's own ENOSPC. The namespace ends with the child,
            // so the folder's contents are copied out to the real folder first.
            ? ["unshare", "--user", "--map-root-user", "--mount", "sh", "-c",
                $"mkdir -p '{folder}/full' && mount -t tmpfs -o size={StorageLimit} tmpfs '{folder}/full' && \"$@\"; rc=$?; cp -a '{folder}/full/.' '{folder}/'; exit $rc", "sh"]
            // RLIMIT_FSIZE (prlimit) caps every file the child writes; with SIGXFSZ ignored (inherited through exec)
            // the write past the cap fails with EFBIG, as a file past 4 GiB does on FAT32. W^X double mapping is off
            // because the runtime's memfd mapping would hit the cap at startup.
            : ["sh", "-c", $"trap '' XFSZ; exec prlimit --fsize={StorageLimit} env DOTNET_EnableWriteXorExecute=0 \"$@\"", "sh"];
        string[] args = IngestArgs(fault == "full-disk" ? Path.Combine(folder, "full", "fresh.lookup") : index);

        var (exitCode, output, error) = LookupProcess.Run(args, wrapper);

        Assert.True(exitCode == 1, $"exit code {exitCode}\nstdout: {output}\nstderr: {error}");
        Assert.StartsWith($"lookup ingest: writing {args[3]} failed: ", error, StringComparison.Ordinal);
        Assert.Contains(reason, error, StringComparison.Ordinal);
        Assert.Contains("Every transaction committed before the failure is kept", error, StringComparison.Ordinal);
        AssertNoStackTrace(error);
        var kept = IndexSnapshot.Read(index);
        Assert.InRange(kept.Indexed.Count(), 1, IngestedTemplate.Photos - 1);
        AssertNoErrors(index);

        var rerun = LookupProcess.Run(IngestArgs(index));

        Assert.True(rerun.ExitCode == 0, rerun.Error);
        using var summary = JsonDocument.Parse(rerun.Output);
        Assert.Equal(IngestedTemplate.Photos - kept.Indexed.Count(), summary.RootElement.GetProperty("embedded").GetInt32());
        AssertComplete(index);
    }

    [Fact]
    public void An_ingest_killed_right_after_it_takes_the_writer_lock_leaves_an_index_the_rerun_completes()
    {
        string index = Path.Combine(Path.GetDirectoryName(template.CopyOfIndex())!, "fresh.lookup");
        using (var child = LookupProcess.Start(IngestArgs(index)))
        {
            WaitFor(child, () => LockedFileText.TryRead(WriterLock.PathFor(index)) is { Length: > 0 }, "the writer lock");
            child.KillHard();
            child.WaitForExit();
        }

        if (File.Exists(index))
        {
            AssertNoErrors(index);
        }

        var rerun = LookupProcess.Run(IngestArgs(index));

        Assert.True(rerun.ExitCode == 0, rerun.Error);
        AssertComplete(index);
    }

    [Fact]
    public void An_ingest_killed_while_it_retires_and_replaces_photos_keeps_a_consistent_index_and_the_rerun_ends_with_each_photo_once()
    {
        using var tree = new IngestTree();
        for (int i = 0; i < IngestedTemplate.Photos; i++)
        {
            tree.Add(IngestedTemplate.PhotoPath(i), IngestTree.Distinct[i]);
        }

        Assert.Equal(0, LookupProcess.Run(IngestArgs(tree.IndexPath, tree.Root)).ExitCode);
        // Four photos change content, two are removed, three are added.
        var expected = Enumerable.Range(0, IngestedTemplate.Photos).ToDictionary(IngestedTemplate.PhotoPath, i => IngestTree.Distinct[i]);
        for (int i = 0; i < 4; i++)
        {
            string path = IngestedTemplate.PhotoPath(i);
            File.WriteAllBytes(tree.PathOf(path), IngestTree.Bytes(IngestTree.Distinct[12 + i]));
            File.SetLastWriteTimeUtc(tree.PathOf(path), TempTree.FixedTime.AddHours(1));
            expected[path] = IngestTree.Distinct[12 + i];
        }

        foreach (int i in new[] { 10, 11 })
        {
            File.Delete(tree.PathOf(IngestedTemplate.PhotoPath(i)));
            expected.Remove(IngestedTemplate.PhotoPath(i));
        }

        for (int i = 16; i < 19; i++)
        {
            string path = $"S-new/{i}{Path.GetExtension(IngestTree.Distinct[i])}";
            tree.Add(path, IngestTree.Distinct[i]);
            expected[path] = IngestTree.Distinct[i];
        }

        var newContent = expected.Values.Skip(0).Where(r => Array.IndexOf(IngestTree.Distinct, r) >= 12).Select(r => Sha(IngestTree.Bytes(r))).ToHashSet();
        using (var child = LookupProcess.Start(IngestArgs(tree.IndexPath, tree.Root)))
        {
            WaitFor(child, () => Snapshot(tree.IndexPath)?.Indexed.Count(r => newContent.Contains(r.Sha256!)) >= 2, "two new photos committed");
            child.KillHard();
            child.WaitForExit();
        }

        var killed = IndexSnapshot.Read(tree.IndexPath);
        Assert.InRange(killed.Indexed.Count(r => newContent.Contains(r.Sha256!)), 2, newContent.Count - 1);
        AssertNoErrors(tree.IndexPath);

        Assert.Equal(0, LookupProcess.Run(IngestArgs(tree.IndexPath, tree.Root)).ExitCode);

        var final = IndexSnapshot.Read(tree.IndexPath);
        Assert.Equal(expected.Keys.Order(StringComparer.Ordinal), final.Records.Keys.Order(StringComparer.Ordinal));
        Assert.All(expected, e => Assert.Equal(Sha(IngestTree.Bytes(e.Value)), final.Records[e.Key].Sha256));
        Assert.Equal(expected.Count, final.Graph!.LiveCount);
        AssertNoErrors(tree.IndexPath);
    }

    [Theory]
    [InlineData("reading")]
    [InlineData("sweeping")]
    [InlineData("storing")]
    public void A_sweep_killed_while_stage_leaves_photos_and_graph_untouched_and_the_next_sweep_is_stored(string stage)
    {
        string index = template.CopyOfIndex();
        string digest = IndexSnapshot.Read(index).Digest();
        using (var child = LookupProcess.Start(["sweep", "--index", index, "--json"]))
        {
            WaitFor(child, () => child.Error.Contains($"lookup sweep: {stage}", StringComparison.Ordinal), $"the {stage} stage", exitAllowed: true);
            child.KillHard();
            child.WaitForExit();
        }

        Assert.Equal(digest, IndexSnapshot.Read(index).Digest());
        AssertNoErrors(index);
        int stored = StoredSweeps(index);
        Assert.InRange(stored, 0, 1);

        var (exitCode, _, error) = LookupProcess.Run(["sweep", "--index", index, "--json", "--quiet"]);

        Assert.True(exitCode is 0 or 3, $"exit code {exitCode}: {error}");
        Assert.Equal(stored + 1, StoredSweeps(index));
    }

    /// <summary>Bytes of storage (or of any one file) the child gets: the first few one-photo commits (about 100 KiB of
    /// journal each, measured) fit, the 12-photo run does not.</summary>
    private const int StorageLimit = 512 * 1024;

    private static string[] IngestArgs(string index, string? root = null) =>
        ["ingest", root ?? "", "--index", index, "--json", "--quiet", "--workers", "1", "--batch-size", "1"];

    private string[] IngestArgs(string index) => IngestArgs(index, template.Root);

    private string[] Command(string command, string index) => command switch
    {
        "ingest" => ["ingest", template.Root, "--index", index, "--quiet"],
        "match" => ["match", template.Photo(0), "--index", index],
        "sweep" => ["sweep", "--index", index, "--quiet"],
        _ => [command, "--index", index],
    };

    private string MakeIndex(string kind)
    {
        string index = template.CopyOfIndex();
        switch (kind)
        {
            case "text":
                File.WriteAllText(index, "file,sku\nS-0/00.jpg,S-0\n");
                break;
            case "zip":
                File.Delete(index);
                using (var zip = ZipFile.Open(index, ZipArchiveMode.Create))
                {
                    for (int i = 0; i < 4; i++)
                    {
                        zip.CreateEntryFromFile(template.Photo(i), $"photo{i}.jpg", CompressionLevel.NoCompression);
                    }
                }

                break;
            case "other-litedb":
                File.Delete(index);
                using (var db = new LiteDatabase(index))
                {
                    db.GetCollection("customers").Insert(new BsonDocument { ["name"] = "Invented Fasteners Ltd" });
                }

                break;
            case "newer-schema":
                using (var file = IndexFile.Open(index, IndexAccess.Write))
                {
                    file.InTransaction(() =>
                    {
                        var schema = file.Database.GetCollection("lookup_meta").FindById("schema");
                        schema["version"] = 99;
                        file.Database.GetCollection("lookup_meta").Upsert(schema);
                    });
                }

                break;
            case "header-only":
                Truncate(index, 4000);
                break;
            case "cut-in-half":
                Truncate(index, new FileInfo(index).Length / 2);
                break;
            case "overwritten-pages":
                // Every page after the header page filled with a fixed-seed random pattern: the file keeps its
                // length and header, so only reading its contents can show the damage.
                byte[] bytes = File.ReadAllBytes(index);
                new Random(9).NextBytes(bytes.AsSpan(8192));
                File.WriteAllBytes(index, bytes);
                break;
        }

        return index;
    }

    private static void Truncate(string path, long length)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Write);
        stream.SetLength(length);
    }

    private static void AssertNoStackTrace(string text)
    {
        Assert.DoesNotContain("   at ", text, StringComparison.Ordinal);
        Assert.DoesNotContain("Unhandled exception", text, StringComparison.Ordinal);
    }

    /// <summary>The index check (the engine behind <c>lookup check</c>) finds no error.</summary>
    private static void AssertNoErrors(string index)
    {
        using var file = IndexFile.Open(index, IndexAccess.Read);
        var report = IndexChecker.Check(file, verifyModelFiles: false);
        Assert.True(report.IsHealthy, string.Join("\n", report.Findings.Select(f => $"{f.Code}: {f.Message}")));
    }

    /// <summary>All 12 template photos indexed once each, every node owned by one photo, no error.</summary>
    private static void AssertComplete(string index)
    {
        var snapshot = IndexSnapshot.Read(index);
        Assert.Equal(
            Enumerable.Range(0, IngestedTemplate.Photos).Select(IngestedTemplate.PhotoPath).Order(StringComparer.Ordinal),
            snapshot.Indexed.Select(r => r.Path).Order(StringComparer.Ordinal));
        Assert.Equal(IngestedTemplate.Photos, snapshot.Graph!.LiveCount);
        Assert.Equal(IngestedTemplate.Photos, snapshot.Indexed.Select(r => r.NodeId).Distinct().Count());
        AssertNoErrors(index);
    }

    private static IndexSnapshot? Snapshot(string index)
    {
        try
        {
            return IndexSnapshot.Read(index);
        }
        catch (IndexFileException)
        {
            return null;
        }
    }

    private static int StoredSweeps(string index)
    {
        using var file = IndexFile.Open(index, IndexAccess.Read);
        return new SweepStore(file).History().Count();
    }

    private static string Sha(byte[] bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));

    private static void WaitFor(LookupProcess child, Func<bool> condition, string what, bool exitAllowed = false)
    {
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed < PollLimit)
        {
            if (condition())
            {
                return;
            }

            if (child.HasExited)
            {
                Assert.True(exitAllowed, $"lookup exited before {what}: {child.Error}");
                return;
            }

            Thread.Sleep(10);
        }

        throw new TimeoutException($"no {what} after {PollLimit}");
    }

    private static (int ExitCode, string Error) Shell(string[] command)
    {
        var info = new ProcessStartInfo(command[0]) { RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var arg in command.Skip(1))
        {
            info.ArgumentList.Add(arg);
        }

        using var process = Process.Start(info)!;
        string error = process.StandardError.ReadToEnd();
        process.WaitForExit();
        return (process.ExitCode, error);
    }

    /// <summary>Whether the operating system refuses creating <paramref name="path"/> to the child (through <paramref name="wrapper"/>).</summary>
    private static bool Refuses(string[]? wrapper, string path)
    {
        var probe = new ProcessStartInfo((wrapper ?? ["sh"])[0]) { RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var arg in (wrapper ?? ["sh"]).Skip(1).Concat(wrapper is null ? ["-c", $"touch '{path}'"] : ["touch", path]))
        {
            probe.ArgumentList.Add(arg);
        }

        try
        {
            using var process = Process.Start(probe)!;
            process.WaitForExit();
            return process.ExitCode != 0;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            return false;
        }
    }
}

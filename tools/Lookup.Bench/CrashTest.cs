using System.Diagnostics;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Bench;

/// <summary>
/// `crash-test [--rounds N]`: a child process inserts and deletes in committed batches and is killed with
/// SIGKILL at a random moment; the parent then opens the index as the next writer (the dead writer's lock must
/// not block), loads the graph and checks that it holds a whole number of batches and passes CheckIntegrity.
/// While the child runs, readers open the file again and again and a second writer must be refused.
/// </summary>
internal static class CrashTest
{
    private const int Dimension = 64;
    private const int BatchInserts = 300;

    public static int Run(string[] args)
    {
        int at = Array.IndexOf(args, "--rounds");
        int rounds = at >= 0 ? int.Parse(args[at + 1], System.Globalization.CultureInfo.InvariantCulture) : 8;
        string dir = Path.Combine(Path.GetTempPath(), "lookup-crash-" + Environment.ProcessId);
        Directory.CreateDirectory(dir);
        string path = Path.Combine(dir, "crash.lookup");
        var random = new Random(5);
        int failures = 0;
        for (int round = 1; round <= rounds; round++)
        {
            using var child = StartWriter(path, round);
            int lastReported = -1;
            child.OutputDataReceived += (_, line) =>
            {
                if (int.TryParse(line.Data, out int count))
                {
                    Volatile.Write(ref lastReported, count);
                }
            };
            child.BeginOutputReadLine();
            var (reads, readFailures, holderNamed) = ReadWhileWriting(path, child, () => Volatile.Read(ref lastReported) >= 0, TimeSpan.FromMilliseconds(random.Next(500, 3000)));
            failures += readFailures > 0 ? 1 : 0;
            child.Kill();
            child.WaitForExit();

            var watch = Stopwatch.StartNew();
            using var file = IndexFile.Open(path, IndexAccess.Write);
            var store = new GraphStore(file);
            if (!store.HasGraph)
            {
                Console.WriteLine($"round {round}: killed before the first commit; file opens, no graph yet");
                continue;
            }

            var graph = store.Load();
            var report = graph.CheckIntegrity();
            bool whole = graph.Count % BatchInserts == 0 && graph.Count >= lastReported;
            bool searchable = graph.Count == 0 || graph.Search(graph.GetVector(graph.Entry.Id), 5).Length == 5;
            bool ok = report.IsHealthy && whole && searchable;
            failures += ok ? 0 : 1;
            Console.WriteLine($"round {round}: {reads} reader opens while it wrote ({readFailures} failed; second writer refused naming its pid: {holderNamed}); killed after {lastReported} reported; reopened as writer in {watch.ElapsedMilliseconds} ms; {graph.Count} nodes ({graph.LiveCount} live), integrity {report}, whole batches {whole} → {(ok ? "ok" : "FAILED")}");
        }

        Directory.Delete(dir, recursive: true);
        Console.WriteLine(failures == 0 ? $"all {rounds} rounds ok" : $"{failures} of {rounds} rounds FAILED");
        return failures == 0 ? 0 : 1;
    }

    /// <summary>
    /// While the child writes: a second writer must be refused naming the child's pid, and readers opened
    /// again and again must each see a whole number of batches that passes CheckIntegrity and answers a search.
    /// </summary>
    private static (int Reads, int Failures, bool HolderNamed) ReadWhileWriting(string path, Process child, Func<bool> childHoldsLock, TimeSpan duration)
    {
        var deadline = DateTime.UtcNow + duration;
        int reads = 0, failures = 0;
        bool holderNamed = false;
        while (DateTime.UtcNow < deadline)
        {
            Thread.Sleep(100);
            if (!File.Exists(path))
            {
                continue;
            }

            // Only once the child has committed (so it surely holds the lock), else the test races its start-up.
            try
            {
                if (!childHoldsLock())
                {
                    throw new IndexFileException(path, IndexFileProblem.WriterActive, "child still starting");
                }

                using var second = IndexFile.Open(path, IndexAccess.Write);
                Console.WriteLine(child.HasExited
                    ? $"  the writer process died by itself (exit code {child.ExitCode}) before the kill"
                    : "  a second writer was NOT refused while the writer process was alive");
                failures++;
            }
            catch (IndexFileException error) when (error.Problem == IndexFileProblem.WriterActive)
            {
                holderNamed |= error.Holder?.ProcessId == child.Id;
            }

            try
            {
                using var file = IndexFile.Open(path, IndexAccess.Read);
                var store = new GraphStore(file);
                if (store.HasGraph)
                {
                    var graph = store.Load();
                    bool ok = graph.Count % BatchInserts == 0 && graph.CheckIntegrity().IsHealthy
                        && (graph.Count == 0 || store.OpenLazy().Search(graph.GetVector(graph.Entry.Id), 5).Length == 5);
                    failures += ok ? 0 : 1;
                }

                reads++;
            }
            catch (IndexFileException error) when (error.Problem == IndexFileProblem.NotAnIndex && error.Message.Contains("no schema record", StringComparison.Ordinal))
            {
                // The child has created the file but not yet committed its first transaction.
            }
            catch (Exception error) when (error is IndexFileException or IOException or LiteDB.LiteException or InvalidDataException)
            {
                Console.WriteLine($"  reader failed: {error.Message}");
                failures++;
            }
        }

        return (reads, failures, holderNamed);
    }

    /// <summary>The child: open as writer, then insert/delete/commit batches until killed, printing each committed count.</summary>
    public static int Writer(string path, int seed)
    {
        // Checkpoint after almost every commit, so some kills land inside a checkpoint.
        IndexFile.CheckpointThreshold = 256 << 10;
        using var file = IndexFile.Open(path, IndexAccess.Write);
        var store = new GraphStore(file);
        var parameters = new HnswParameters(M: 8, EfConstruction: 48, ExactBelow: 0);
        var graph = store.HasGraph ? store.Load() : store.Create(Dimension, parameters, "crash-test");
        var random = new Random(seed);
        var vector = new float[Dimension];
        while (true)
        {
            for (int i = 0; i < BatchInserts; i++)
            {
                for (int j = 0; j < Dimension; j++)
                {
                    vector[j] = (float)(random.NextDouble() - 0.5);
                }

                graph.Add(vector);
                if (i % 10 == 0 && graph.LiveCount > 50)
                {
                    graph.Delete(random.Next(graph.Count));
                }
            }

            store.Commit(graph);
            Console.WriteLine(graph.Count);
            Console.Out.Flush();
        }
    }

    private static Process StartWriter(string path, int seed)
    {
        var self = Environment.GetCommandLineArgs()[0];
        var info = new ProcessStartInfo
        {
            FileName = self.EndsWith(".dll", StringComparison.Ordinal) ? "dotnet" : self,
            RedirectStandardOutput = true,
            UseShellExecute = false,
        };
        if (self.EndsWith(".dll", StringComparison.Ordinal))
        {
            info.ArgumentList.Add(self);
        }

        info.ArgumentList.Add("crash-writer");
        info.ArgumentList.Add(path);
        info.ArgumentList.Add(seed.ToString(System.Globalization.CultureInfo.InvariantCulture));
        return Process.Start(info)!;
    }
}

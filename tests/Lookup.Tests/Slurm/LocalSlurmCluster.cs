using System.Diagnostics;
using System.Globalization;
using System.Text;

namespace Lookup.Tests.Slurm;

/// <summary>
/// A one-node Slurm cluster started by tools/slurm/local-cluster.sh in a folder of its own. Dispose stops exactly
/// the daemons it started: the script sends TERM to the PIDs it recorded, then anything still alive from that list
/// is killed here by PID.
/// </summary>
internal sealed class LocalSlurmCluster : IDisposable
{
    private readonly string _script;

    private LocalSlurmCluster(string script, string folder)
    {
        _script = script;
        Folder = folder;
    }

    /// <summary>The cluster's folder (slurm.conf, state, spool, logs, munge socket).</summary>
    public string Folder { get; }

    public string ConfigPath => Path.Combine(Folder, "slurm.conf");

    /// <summary>SLURM_CONF for the clients (sbatch, scontrol) and the job scripts.</summary>
    public IReadOnlyDictionary<string, string> Environment => new Dictionary<string, string> { ["SLURM_CONF"] = ConfigPath };

    public static LocalSlurmCluster Start(string repositoryRoot, string folder)
    {
        string script = Path.Combine(repositoryRoot, "tools", "slurm", "local-cluster.sh");
        var cluster = new LocalSlurmCluster(script, folder);
        try
        {
            var (exitCode, _, error) = ShellCommand.Run("bash", [script, "start", folder], limit: TimeSpan.FromMinutes(5));
            if (exitCode != 0)
            {
                throw new InvalidOperationException($"{script} start {folder} exited {exitCode}:\n{error}\n{cluster.Logs()}");
            }
        }
        catch
        {
            cluster.Dispose();
            throw;
        }

        return cluster;
    }

    /// <summary>The last lines of every daemon log, for failure messages.</summary>
    public string Logs()
    {
        var text = new StringBuilder();
        string logs = Path.Combine(Folder, "log");
        if (!Directory.Exists(logs))
        {
            return "(no logs)";
        }

        foreach (string file in Directory.GetFiles(logs).Order(StringComparer.Ordinal))
        {
            text.AppendLine(CultureInfo.InvariantCulture, $"== {file}");
            foreach (string line in File.ReadLines(file).TakeLast(15))
            {
                text.AppendLine(line);
            }
        }

        return text.ToString();
    }

    public void Dispose()
    {
        var started = RecordedPids();
        try
        {
            ShellCommand.Run("bash", [_script, "stop", Folder], limit: TimeSpan.FromMinutes(1));
        }
        finally
        {
            foreach (var (name, pid) in started)
            {
                KillIfStill(name, pid);
            }
        }
    }

    private List<(string Name, int Pid)> RecordedPids()
    {
        string file = Path.Combine(Folder, "pids");
        return File.Exists(file)
            ? [.. File.ReadLines(file)
                .Select(line => line.Split(' ', StringSplitOptions.RemoveEmptyEntries))
                .Where(fields => fields.Length == 2)
                .Select(fields => (fields[0], int.Parse(fields[1], CultureInfo.InvariantCulture)))]
            : [];
    }

    // Only while the PID still runs the program that was started under it (a PID can be reused once it exits).
    private static void KillIfStill(string name, int pid)
    {
        try
        {
            using var process = Process.GetProcessById(pid);
            if (!process.HasExited && process.ProcessName == name)
            {
                process.Kill();
                process.WaitForExit(5_000);
            }
        }
        catch (ArgumentException)
        {
            // Already gone: the stop script did its job.
        }
        catch (InvalidOperationException)
        {
            // Exited between the lookup and the kill.
        }
    }
}

using System.Diagnostics;
using System.Text;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// The real <c>lookup</c> executable (Lookup.Cli.dll from the test output, run by the dotnet host) in a child
/// process, with stdout and stderr collected as they arrive, so a test can kill or interrupt it mid-run.
/// </summary>
internal sealed class LookupProcess : IDisposable
{
    private static readonly TimeSpan ExitWait = TimeSpan.FromMinutes(2);

    private readonly Process _process;
    private readonly StringBuilder _output = new();
    private readonly StringBuilder _error = new();

    private LookupProcess(Process process)
    {
        _process = process;
        _process.OutputDataReceived += (_, e) => Append(_output, e.Data);
        _process.ErrorDataReceived += (_, e) => Append(_error, e.Data);
        _process.BeginOutputReadLine();
        _process.BeginErrorReadLine();
    }

    public int Id => _process.Id;

    public bool HasExited => _process.HasExited;

    public string Output => Read(_output);

    public string Error => Read(_error);

    /// <summary>Starts <c>lookup</c> with <paramref name="args"/>, optionally through a wrapper command (e.g. setpriv).</summary>
    public static LookupProcess Start(IEnumerable<string> args, IReadOnlyList<string>? wrapper = null)
    {
        string host = Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } path && File.Exists(path) ? path : "dotnet";
        string cli = Path.Combine(AppContext.BaseDirectory, "Lookup.Cli.dll");
        var command = new List<string>(wrapper ?? []) { host, cli };
        command.AddRange(args);
        var info = new ProcessStartInfo(command[0])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            WorkingDirectory = Path.GetTempPath(),
        };
        foreach (var arg in command.Skip(1))
        {
            info.ArgumentList.Add(arg);
        }

        return new LookupProcess(Process.Start(info) ?? throw new InvalidOperationException($"could not start {command[0]}"));
    }

    /// <summary>Runs <c>lookup</c> to the end and returns its exit code.</summary>
    public static (int ExitCode, string Output, string Error) Run(IEnumerable<string> args, IReadOnlyList<string>? wrapper = null)
    {
        using var process = Start(args, wrapper);
        int exitCode = process.WaitForExit();
        return (exitCode, process.Output, process.Error);
    }

    /// <summary>SIGKILL: the process gets no chance to clean up, as in a power cut or the OOM killer.</summary>
    public void KillHard() => _process.Kill(entireProcessTree: true);

    /// <summary>
    /// Sends <paramref name="signal"/> (e.g. INT, TERM) with the system's kill command; .NET has no API to signal
    /// another process gracefully.
    /// </summary>
    public void Signal(string signal)
    {
        using var kill = Process.Start(new ProcessStartInfo("kill") { ArgumentList = { "-" + signal, Id.ToString(System.Globalization.CultureInfo.InvariantCulture) } })!;
        kill.WaitForExit();
    }

    /// <summary>
    /// True when the child inherited SIGINT as ignored (a parent shell ran the tests as a background job), in which
    /// case the operating system never delivers Ctrl+C to it. Read from /proc/PID/status (proc(5), SigIgn).
    /// </summary>
    public bool IgnoresInterrupt()
    {
        string? line = File.ReadLines($"/proc/{Id}/status").FirstOrDefault(l => l.StartsWith("SigIgn:", StringComparison.Ordinal));
        return line is not null && (Convert.ToUInt64(line["SigIgn:".Length..].Trim(), 16) & (1UL << (2 - 1))) != 0;
    }

    public int WaitForExit()
    {
        if (!_process.WaitForExit(ExitWait))
        {
            _process.Kill(entireProcessTree: true);
            throw new TimeoutException($"lookup did not exit within {ExitWait}; stderr so far:\n{Error}");
        }

        _process.WaitForExit();
        return _process.ExitCode;
    }

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
            _process.WaitForExit();
        }

        _process.Dispose();
    }

    private static void Append(StringBuilder text, string? line)
    {
        if (line is null)
        {
            return;
        }

        lock (text)
        {
            text.Append(line).Append('\n');
        }
    }

    private static string Read(StringBuilder text)
    {
        lock (text)
        {
            return text.ToString();
        }
    }
}

using System.Globalization;
using Lookup.Tests.Catalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// Reads a child's peak resident set (VmHWM in /proc/PID/status, proc(5)) until it exits. VmHWM only grows, so the
/// last reading before exit is the peak up to then; only the last poll interval before exit can be missed.
/// </summary>
internal static class PeakMemory
{
    private static readonly TimeSpan Poll = TimeSpan.FromMilliseconds(10);

    /// <summary>Waits for <paramref name="process"/> to exit; returns its exit code and peak resident bytes.</summary>
    public static (int ExitCode, long PeakBytes) WaitForExit(LookupProcess process)
    {
        var status = $"/proc/{process.Id}/status";
        long peak = 0;
        var deadline = DateTime.UtcNow + TimeSpan.FromMinutes(5);
        while (!process.HasExited && DateTime.UtcNow < deadline)
        {
            peak = Math.Max(peak, Read(status));
            Thread.Sleep(Poll);
        }

        return (process.WaitForExit(), peak);
    }

    private static long Read(string status)
    {
        try
        {
            var line = File.ReadLines(status).FirstOrDefault(l => l.StartsWith("VmHWM:", StringComparison.Ordinal));
            return line is null ? 0 : long.Parse(line["VmHWM:".Length..].Trim().Split(' ')[0], CultureInfo.InvariantCulture) * 1024;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The process exited between the check and the read.
            return 0;
        }
    }
}

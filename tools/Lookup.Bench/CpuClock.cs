using System.Runtime.InteropServices;

namespace Lookup.Bench;

/// <summary>
/// CPU time of this thread or this process (Linux <c>clock_gettime</c>, nanosecond resolution). On a machine shared
/// with other work a step's CPU time stays close to what it is on an idle machine while its wall time grows with
/// the load, so the benchmarks report both.
/// </summary>
internal static partial class CpuClock
{
    private const int ProcessClock = 2;
    private const int ThreadClock = 3;

    /// <summary>CPU time of the calling thread, in milliseconds.</summary>
    public static double ThreadMs() => Read(ThreadClock);

    /// <summary>CPU time of the whole process (all threads), in milliseconds.</summary>
    public static double ProcessMs() => Read(ProcessClock);

    private static double Read(int clock)
    {
        if (ClockGetTime(clock, out var time) != 0)
        {
            throw new InvalidOperationException($"clock_gettime({clock}) failed: this benchmark needs Linux.");
        }

        return (time.Seconds * 1e3) + (time.Nanoseconds / 1e6);
    }

    [LibraryImport("libc", EntryPoint = "clock_gettime")]
    private static partial int ClockGetTime(int clock, out TimeSpec time);

    [StructLayout(LayoutKind.Sequential)]
    private struct TimeSpec
    {
        public long Seconds;
        public long Nanoseconds;
    }
}

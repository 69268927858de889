using System.Diagnostics;
using System.Globalization;

namespace Lookup.Cli.Output;

/// <summary>
/// Progress on stderr: one line redrawn in place on a terminal, plain periodic lines otherwise
/// (logs of unattended runs stay readable), nothing with --quiet.
/// </summary>
internal sealed class ProgressLine
{
    private static readonly TimeSpan TerminalInterval = TimeSpan.FromMilliseconds(200);
    private static readonly TimeSpan LogInterval = TimeSpan.FromSeconds(10);

    private readonly TextWriter _error;
    private readonly bool _quiet;
    private readonly bool _terminal;
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private TimeSpan? _lastDrawn;
    private int _lastWidth;

    public ProgressLine(TextWriter error, bool quiet)
    {
        _error = error;
        _quiet = quiet;
        _terminal = !Console.IsErrorRedirected;
    }

    public TimeSpan Elapsed => _clock.Elapsed;

    /// <summary>Shows done/total with rate, ETA and failures; throttled so it costs nothing in a hot loop.</summary>
    public void Report(string stage, long done, long total, long failed, bool force = false)
    {
        if (_quiet)
        {
            return;
        }

        TimeSpan now = _clock.Elapsed;
        // Nullable rather than TimeSpan.MinValue: now − MinValue overflows and threw on the first report.
        if (!force && _lastDrawn is { } last && now - last < (_terminal ? TerminalInterval : LogInterval))
        {
            return;
        }

        _lastDrawn = now;
        double rate = done / Math.Max(now.TotalSeconds, 1e-3);
        string eta = rate > 0 && total > done ? FormatDuration(TimeSpan.FromSeconds((total - done) / rate)) : "-";
        string line = string.Create(
            CultureInfo.InvariantCulture,
            $"{stage} {done}/{total} ({Percent(done, total)}) {rate:0.0} photos/s, ETA {eta}, failed {failed}");
        if (_terminal)
        {
            _error.Write('\r' + line.PadRight(_lastWidth));
            _lastWidth = line.Length;
        }
        else
        {
            _error.WriteLine(line);
        }
    }

    /// <summary>Ends the in-place line so later output starts on a fresh line.</summary>
    public void Finish()
    {
        if (!_quiet && _terminal && _lastWidth > 0)
        {
            _error.WriteLine();
            _lastWidth = 0;
        }
    }

    private static string Percent(long done, long total) =>
        total <= 0 ? "-" : (100.0 * done / total).ToString("0", CultureInfo.InvariantCulture) + " %";

    internal static string FormatDuration(TimeSpan span) =>
        span.TotalHours >= 1
            ? $"{(int)span.TotalHours}h{span.Minutes:00}m"
            : span.TotalMinutes >= 1 ? $"{span.Minutes}m{span.Seconds:00}s" : $"{span.TotalSeconds:0}s";
}

using System.Globalization;

namespace Lookup.Store;

/// <summary>Who holds the writer lock of an index: written into the lock file so a refused second writer (or a person with <c>cat</c>) can name it.</summary>
public sealed record WriterInfo(int ProcessId, string Host, string Command, DateTimeOffset Started)
{
    /// <summary>This process.</summary>
    public static WriterInfo Current() =>
        new(Environment.ProcessId, Environment.MachineName, string.Join(' ', Environment.GetCommandLineArgs()), DateTimeOffset.UtcNow);

    /// <summary>Plain "key: value" lines.</summary>
    public string Format() => string.Create(
        CultureInfo.InvariantCulture,
        $"pid: {ProcessId}\nhost: {Host}\ncommand: {Command.ReplaceLineEndings(" ")}\nstarted: {Started:O}\n");

    /// <summary>Reads <see cref="Format"/>'s output; null when the text is incomplete (e.g. a lock file being written).</summary>
    public static WriterInfo? Parse(string text)
    {
        var fields = text.Split('\n', StringSplitOptions.RemoveEmptyEntries)
            .Select(line => line.Split(": ", 2))
            .Where(parts => parts.Length == 2)
            .ToDictionary(parts => parts[0], parts => parts[1]);
        return fields.TryGetValue("pid", out var pid) && int.TryParse(pid, CultureInfo.InvariantCulture, out int id)
            && fields.TryGetValue("host", out var host) && fields.TryGetValue("command", out var command)
            && fields.TryGetValue("started", out var started)
            && DateTimeOffset.TryParse(started, CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind, out var when)
            ? new WriterInfo(id, host, command, when)
            : null;
    }

    /// <inheritdoc />
    public override string ToString() =>
        string.Create(CultureInfo.InvariantCulture, $"pid {ProcessId} on {Host} since {Started:yyyy-MM-dd HH:mm:ss}Z ({Command})");
}

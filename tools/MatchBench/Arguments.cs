using System.Globalization;

namespace MatchBench;

/// <summary>--name value pairs.</summary>
internal sealed class Arguments(Dictionary<string, string> values)
{
    public static Arguments Parse(IEnumerable<string> args)
    {
        var list = args.ToList();
        var values = new Dictionary<string, string>(StringComparer.Ordinal);
        for (int i = 0; i + 1 < list.Count; i += 2)
        {
            values[list[i].TrimStart('-')] = list[i + 1];
        }

        return new Arguments(values);
    }

    public string Get(string name, string? fallback = null) =>
        values.TryGetValue(name, out var v) ? v : fallback ?? throw new ArgumentException($"--{name} is required");

    public int Int(string name, int fallback) => values.TryGetValue(name, out var v) ? int.Parse(v, CultureInfo.InvariantCulture) : fallback;

    public double Double(string name, double fallback) => values.TryGetValue(name, out var v) ? double.Parse(v, CultureInfo.InvariantCulture) : fallback;
}

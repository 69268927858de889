using Lookup.Catalogue;

namespace Lookup.Sweeps;

/// <summary>
/// Reads reviewers' decisions from a CSV table (RFC 4180, header row, names in any case and order):
/// <list type="bullet">
/// <item><c>finding_key</c> (or <c>key</c>): a finding or pair key; or <c>first_path</c> and <c>second_path</c>: two
/// photos. A sweep's own CSV (<c>lookup sweep --csv</c>) has <c>finding_key</c>, so a reviewer can keep the rows of
/// the findings that are not duplicates and feed the file back.</item>
/// <item><c>note</c> and <c>reviewer</c>: optional, per row.</item>
/// <item><c>decision</c>: optional; when present only rows saying <c>not-duplicate</c> (or <c>dismiss</c>) count, and
/// rows left empty or saying anything else are skipped, so one sheet can hold rows still to be reviewed.</item>
/// </list>
/// Rows naming the same key or pair again are read once (a sweep CSV has a row per photo). A cell our CSV writer
/// protected against formulas (a leading <c>'</c> before <c>= + - @</c>) is read back without the <c>'</c>.
/// </summary>
public static class DecisionCsv
{
    private static readonly string[] Dismissing = ["not-duplicate", "not a duplicate", "dismiss"];

    /// <summary>Reads <paramref name="path"/>.</summary>
    /// <returns>The requests, the problems (each naming the file and line), and how many rows were skipped by their
    /// <c>decision</c> cell.</returns>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static (IReadOnlyList<DismissRequest> Requests, IReadOnlyList<string> Problems, int Skipped) Read(string path)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        return Parse(File.ReadAllText(path), path);
    }

    /// <summary>Reads CSV text; <paramref name="name"/> is used in messages and as the requests' source.</summary>
    public static (IReadOnlyList<DismissRequest> Requests, IReadOnlyList<string> Problems, int Skipped) Parse(string text, string name)
    {
        ArgumentNullException.ThrowIfNull(text);
        ArgumentNullException.ThrowIfNull(name);
        var records = CsvRecordReader.Read(text.TrimStart('\uFEFF'));
        var problems = new List<string>();
        if (records.Count == 0)
        {
            return ([], [$"{name} is empty: it needs a header row naming finding_key, or first_path and second_path."], 0);
        }

        var header = records[0].Fields.Select((f, i) => (Name: f.Trim().ToLowerInvariant(), i))
            .GroupBy(x => x.Name).ToDictionary(g => g.Key, g => g.First().i, StringComparer.Ordinal);
        var keyColumn = header.ContainsKey("finding_key") ? "finding_key" : header.ContainsKey("key") ? "key" : null;
        if (keyColumn is null && !(header.ContainsKey("first_path") && header.ContainsKey("second_path")))
        {
            return ([], [$"{name} line {records[0].Line}: the header names neither finding_key (or key) nor first_path and second_path; " +
                "add one of them (a sweep's own CSV has finding_key)."], 0);
        }

        var requests = new List<DismissRequest>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var skipped = 0;
        foreach (var record in records.Skip(1))
        {
            string Cell(string column) => header.TryGetValue(column, out var i) && i < record.Fields.Count ? Unprotect(record.Fields[i].Trim()) : "";
            var source = $"{name} line {record.Line}";
            if (record.Error is not null)
            {
                problems.Add($"{source}: {record.Error}");
                continue;
            }

            if (header.ContainsKey("decision") && !Dismissing.Contains(Cell("decision").ToLowerInvariant()))
            {
                skipped++;
                continue;
            }

            var (key, first, second) = (keyColumn is null ? "" : Cell(keyColumn), Cell("first_path"), Cell("second_path"));
            var reviewer = Cell("reviewer");
            var request = key.Length > 0
                ? DismissRequest.ForKey(key, Cell("note"), reviewer.Length > 0 ? reviewer : null, source)
                : first.Length > 0 && second.Length > 0
                    ? DismissRequest.ForPair(first, second, Cell("note"), reviewer.Length > 0 ? reviewer : null, source)
                    : null;
            if (request is null)
            {
                problems.Add($"{source}: neither a key nor two photo paths; fill in finding_key, or first_path and second_path.");
            }
            else if (seen.Add(key.Length > 0 ? key.ToLowerInvariant() : $"{first}\n{second}"))
            {
                requests.Add(request);
            }
        }

        return (requests, problems, skipped);
    }

    /// <summary>Undoes the CSV writer's guard against formula injection (a leading ' before = + - @ tab or CR).</summary>
    private static string Unprotect(string cell) =>
        cell.Length >= 2 && cell[0] == '\'' && cell[1] is '=' or '+' or '-' or '@' or '\t' or '\r' ? cell[1..] : cell;
}

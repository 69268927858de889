using System.Diagnostics;
using System.Text.Json;

namespace MatchBench;

/// <summary>Runs the real lookup command as a process (dotnet Lookup.Cli.dll ...).</summary>
internal sealed class Cli(string dll)
{
    public (string Output, TimeSpan Wall) Run(IEnumerable<string> args)
    {
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        info.ArgumentList.Add(dll);
        foreach (var a in args)
        {
            info.ArgumentList.Add(a);
        }

        var clock = Stopwatch.StartNew();
        using var process = Process.Start(info)!;
        var stderr = process.StandardError.ReadToEndAsync();
        string output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        var wall = clock.Elapsed;
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"lookup {string.Join(' ', args.Take(2))} exited {process.ExitCode}: {stderr.Result}");
        }

        return (output, wall);
    }

    public void Ingest(string tree, string index)
    {
        if (!File.Exists(index))
        {
            Run(["ingest", tree, "--index", index, "--quiet"]);
        }
    }

    /// <summary>Each query ranked alone (--each), every SKU the searches meet listed; the JSON is kept in
    /// <paramref name="cache"/> and read from there on later runs (delete it to measure again).</summary>
    public (Dictionary<string, List<Ranked>> Rankings, TimeSpan Wall) MatchEach(string index, IReadOnlyList<Query> queries, string crops, string cache)
    {
        var (json, wall) = File.Exists(cache)
            ? (File.ReadAllText(cache), TimeSpan.Zero)
            : Run(["match", .. queries.Select(q => q.File), "--index", index, "--each", "--json", "--top", "100", "--crops", crops]);
        File.WriteAllText(cache, json);
        using var doc = JsonDocument.Parse(json);
        var rankings = new Dictionary<string, List<Ranked>>(StringComparer.Ordinal);
        foreach (var answer in doc.RootElement.GetProperty("answers").EnumerateArray())
        {
            rankings[answer.GetProperty("photos")[0].GetString()!] = [.. answer.GetProperty("ranking").EnumerateArray().Select(r => new Ranked(
                r.GetProperty("sku").GetString()!,
                r.GetProperty("distance").GetSingle(),
                r.GetProperty("wholePhotoDistance").GetSingle(),
                r.GetProperty("margin").GetSingle(),
                r.GetProperty("verdict").GetString()!))];
        }

        return (rankings, wall);
    }
}

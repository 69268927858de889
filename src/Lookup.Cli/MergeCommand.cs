using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Lookup.Catalogue;
using Lookup.Cli.Output;
using Lookup.Store;

namespace Lookup.Cli;

/// <summary><c>lookup merge PART... --index FILE</c>: bring shard indexes into one without embedding again.</summary>
internal static class MergeCommand
{
    private const int FailuresShown = 20;

    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        WriteIndented = true,
    };

    public static Command Create()
    {
        var parts = new Argument<string[]>("part") { Description = "Part indexes made by 'lookup ingest --shard K/N'.", Arity = ArgumentArity.OneOrMore };
        var index = IndexOption.Create();
        var json = new Option<bool>("--json") { Description = "Print the summary as JSON on stdout." };
        var quiet = new Option<bool>("--quiet") { Description = "No progress on stderr." };
        var command = new Command(
            "merge",
            """
            Merge part indexes (one per shard of 'lookup ingest --shard K/N') into one index, using the stored
            embeddings: nothing is decoded or embedded again. Parts must come from the same catalogue root, SKU
            mapping, model and graph settings; a part that differs is refused by name and nothing is written.
            Merging a part twice changes nothing; merging new parts into an existing index inserts only what is
            new, and a photo whose content changed replaces its old entry. Photos are never removed by a merge.

            Example:
              lookup merge parts/part-1.lookup parts/part-2.lookup parts/part-3.lookup --index catalogue.lookup

            Exit codes: 0 merged, 1 a part was refused or an index could not be used (nothing written),
            2 usage error, 130 stopped by Ctrl+C (batches already written are kept; run again to finish).
            """)
        {
            parts, index, json, quiet,
        };
        command.SetAction((parseResult, cancellationToken) => Task.FromResult(Run(
            parseResult.GetValue(parts)!,
            parseResult.GetValue(index)!,
            parseResult.GetValue(json),
            parseResult.GetValue(quiet),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error,
            cancellationToken)));
        return command;
    }

    internal static int Run(IReadOnlyList<string> parts, string index, bool json, bool quiet, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        var progressLine = new ProgressLine(error, quiet);
        MergeSummary summary;
        try
        {
            using var file = IndexFile.Open(index, IndexAccess.Write);
            var progress = new SynchronousProgress<MergeProgress>(p => progressLine.Report(p.Stage, p.Done, p.Total, 0, p.Done == p.Total));
            summary = new IndexMerge(file).Run(parts, progress, cancellationToken);
        }
        catch (Exception e) when (e is IndexFileException or MergeRefusedException)
        {
            progressLine.Finish();
            error.WriteLine($"lookup merge: {e.Message}");
            return ExitCodes.Failures;
        }

        progressLine.Finish();
        if (json)
        {
            output.WriteLine(JsonSerializer.Serialize(ToJson(summary, index), Json));
        }
        else
        {
            WriteText(summary, index, output);
        }

        return summary.Cancelled ? ExitCodes.Interrupted : ExitCodes.Success;
    }

    private static void WriteText(MergeSummary s, string index, TextWriter output)
    {
        var table = new TextTable("parts", "read", "added", "replaced", "updated", "unchanged", "superseded", "failed", "time")
            .AlignRight(0, 1, 2, 3, 4, 5, 6, 7, 8);
        table.Add(s.Parts, s.RecordsRead, s.Added, s.Replaced, s.Updated, s.Unchanged, s.Superseded, s.Failures.Count, ProgressLine.FormatDuration(s.Elapsed));
        output.Write(table.ToString());
        string how = s.VectorsInserted == 0
            ? "no vectors inserted"
            : string.Create(CultureInfo.InvariantCulture,
                $"{s.VectorsInserted} vectors inserted {(s.BulkBuild ? "into a graph built in memory" : "into the existing graph")} at {s.VectorsPerSecond:0}/s");
        output.WriteLine($"{index}: {s.IndexedTotal} photos indexed ({how}).{(s.Cancelled ? " Stopped early: run the same command again to finish." : "")}");
        foreach (var failure in s.Failures.Take(FailuresShown))
        {
            output.WriteLine($"failed  {failure.Path}: {failure.Message}");
        }

        if (s.Failures.Count > FailuresShown)
        {
            output.WriteLine($"… and {s.Failures.Count - FailuresShown} more photos recorded as failed (all are listed with --json).");
        }
    }

    private static object ToJson(MergeSummary s, string index) => new
    {
        index,
        s.Parts,
        s.RecordsRead,
        s.Added,
        s.Replaced,
        s.Updated,
        s.Unchanged,
        s.Superseded,
        s.BulkBuild,
        s.VectorsInserted,
        vectorsPerSecond = Math.Round(s.VectorsPerSecond, 1),
        elapsedSeconds = Math.Round(s.Elapsed.TotalSeconds, 3),
        s.Cancelled,
        s.IndexedTotal,
        failed = s.Failures.Count,
        failures = s.Failures,
    };
}

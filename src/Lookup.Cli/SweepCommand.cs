using System.CommandLine;
using System.Text;
using System.Text.Json;
using Lookup.Cli.Output;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Cli;

/// <summary><c>lookup sweep --index FILE</c>: find duplicates and near copies in the catalogue, remember the sweep.</summary>
internal static partial class SweepCommand
{
    public static Command Create()
    {
        var index = IndexOption.Create();
        var report = new Option<string?>("--report") { Description = "Also write a self-contained HTML page (previews side by side, no network) to this file." };
        var csv = new Option<string?>("--csv") { Description = "Also write the findings as CSV (one row per photo per finding) to this file, or - for stdout." };
        var json = new Option<bool>("--json") { Description = "Print the sweep as JSON on stdout instead of the table." };
        var newOnly = new Option<bool>("--new-only") { Description = "Report only findings the previous stored sweep did not have." };
        var failOn = new Option<string>("--fail-on")
        {
            Description = $"Kinds of new findings that make the exit code 3, comma-separated: {string.Join(", ", Kinds.Keys)}, or all.",
            DefaultValueFactory = _ => "all",
        };
        var storeWait = new Option<double>("--store-wait")
        {
            Description = "Seconds to wait for a running ingest to release the index so this sweep can be stored; after that it is reported but not stored.",
            DefaultValueFactory = _ => 0,
        };
        var noStore = new Option<bool>("--no-store") { Description = "Do not remember this sweep (a later --new-only compares with the last stored one)." };
        var threads = new Option<int>("--threads") { Description = "Threads; 0 means one per core.", DefaultValueFactory = _ => 0 };
        var quiet = new Option<bool>("--quiet") { Description = "No progress on stderr." };
        var command = new Command(
            "sweep",
            """
            Look through the whole index for the same photo under several SKUs, copies inside one SKU, look-alikes across
            SKUs and photos far from their SKU. Works on a snapshot, also while an ingest is writing; the sweep is then
            stored when the index is free (see --store-wait). Reviewers' "not a duplicate" decisions (lookup dismiss) are
            applied. Paths are relative to the catalogue root.

            Example:
              lookup sweep --index parts.lookup --report sweep.html
              lookup sweep --index parts.lookup --new-only --csv new.csv --fail-on same-photo,copies

            Exit codes: 0 nothing new, 3 new findings since the previous stored sweep (of the --fail-on kinds),
            1 the index could not be read or a report not written, 2 usage error, 130 stopped by Ctrl+C.
            """)
        {
            index, report, csv, json, newOnly, failOn, storeWait, noStore, threads, quiet,
        };
        command.SetAction((parseResult, cancellationToken) => Task.FromResult(Run(
            new Request(
                parseResult.GetValue(index)!,
                parseResult.GetValue(report),
                parseResult.GetValue(csv),
                parseResult.GetValue(json),
                parseResult.GetValue(newOnly),
                parseResult.GetValue(failOn)!,
                parseResult.GetValue(storeWait),
                parseResult.GetValue(noStore),
                parseResult.GetValue(threads),
                parseResult.GetValue(quiet)),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error,
            cancellationToken)));
        return command;
    }

    /// <summary>The finding kinds by the codes --fail-on takes.</summary>
    private static Dictionary<string, FindingKind> Kinds { get; } =
        Enum.GetValues<FindingKind>().ToDictionary(FindingKindText.Code, k => k, StringComparer.OrdinalIgnoreCase);

    internal static int Run(Request request, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        if (Usage(request) is { } problem)
        {
            error.WriteLine($"lookup sweep: {problem}");
            return ExitCodes.Usage;
        }

        var failOn = ParseKinds(request.FailOn)!;
        var progress = new SynchronousProgress<string>(stage =>
        {
            if (!request.Quiet)
            {
                error.WriteLine($"lookup sweep: {stage} ...");
            }
        });
        IndexSweepResult result;
        try
        {
            result = IndexSweep.Run(
                request.Index,
                new IndexSweepOptions
                {
                    NewOnly = request.NewOnly,
                    Store = !request.NoStore,
                    StoreWait = TimeSpan.FromSeconds(request.StoreWait),
                    MaxDegreeOfParallelism = request.Threads,
                },
                progress,
                cancellationToken: cancellationToken);
        }
        catch (IndexFileException e)
        {
            error.WriteLine($"lookup sweep: {e.Message}");
            return ExitCodes.Failures;
        }
        catch (OperationCanceledException)
        {
            error.WriteLine("lookup sweep: stopped; nothing was stored.");
            return ExitCodes.Interrupted;
        }

        if (!WriteFiles(request, result, progress, output, error, cancellationToken))
        {
            return ExitCodes.Failures;
        }

        if (!result.Stored && !request.NoStore)
        {
            error.WriteLine($"lookup sweep: not stored: {result.NotStoredReason}");
        }

        if (request.Json)
        {
            output.WriteLine(JsonSerializer.Serialize(ToJson(request, result), SweepJsonWriter.Options));
        }
        else if (request.Csv != "-")
        {
            WriteText(request, result, output);
        }

        return result.NewFindings(failOn) > 0 ? ExitCodes.NewFindings : ExitCodes.Success;
    }

    private static string? Usage(Request request)
    {
        if (ParseKinds(request.FailOn) is null)
        {
            return $"--fail-on \"{request.FailOn}\" names an unknown kind; use any of {string.Join(", ", Kinds.Keys)} (comma-separated), or all.";
        }

        if (request.Json && request.Csv == "-")
        {
            return "--json and --csv - both want stdout; write the CSV to a file instead.";
        }

        if (request.Threads < 0 || request.StoreWait < 0 || double.IsNaN(request.StoreWait))
        {
            return "--threads and --store-wait must be 0 or more.";
        }

        return request.Report == "-" ? "--report needs a file name (the HTML page embeds its previews)." : null;
    }

    private static HashSet<FindingKind>? ParseKinds(string text)
    {
        var kinds = new HashSet<FindingKind>();
        foreach (var code in text.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            if (code.Equals("all", StringComparison.OrdinalIgnoreCase))
            {
                kinds.UnionWith(Enum.GetValues<FindingKind>());
            }
            else if (Kinds.TryGetValue(code, out var kind))
            {
                kinds.Add(kind);
            }
            else
            {
                return null;
            }
        }

        return kinds.Count == 0 ? null : kinds;
    }

    private static bool WriteFiles(
        Request request, IndexSweepResult result, IProgress<string> progress, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        try
        {
            if (request.Report is not null)
            {
                progress.Report($"writing {request.Report}");
                WriteHtmlReport(request.Report, result, Caption(request, result), request.Threads, cancellationToken);
            }

            if (request.Csv == "-")
            {
                SweepCsvWriter.Write(result.Report, output);
            }
            else if (request.Csv is not null)
            {
                WriteAtomically(request.Csv, writer => SweepCsvWriter.Write(result.Report, writer));
            }

            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"lookup sweep: could not write a report: {e.Message} Check the folder exists and is writable.");
            return false;
        }
    }

    /// <summary>Writes the self-contained HTML page of a sweep, previews read from the catalogue root (also used by
    /// <c>lookup demo</c>).</summary>
    /// <exception cref="IOException">The file could not be written.</exception>
    internal static void WriteHtmlReport(string path, IndexSweepResult result, string caption, int threads, CancellationToken cancellationToken)
    {
        var previews = CataloguePreviews.Prepare(
            result.CatalogueRoot, result.Report.Findings, maxDegreeOfParallelism: threads, cancellationToken: cancellationToken);
        WriteAtomically(path, writer => SweepHtmlWriter.Write(
            result.Report, writer, previews, caption: caption, newKeys: result.NewKeys, calibration: result.Calibration));
    }

    /// <summary>Writes to a temporary file beside <paramref name="path"/> and moves it into place, so a reader never
    /// sees half a report.</summary>
    private static void WriteAtomically(string path, Action<TextWriter> write)
    {
        var full = Path.GetFullPath(path);
        var temporary = full + ".part";
        using (var writer = new StreamWriter(temporary, append: false, new UTF8Encoding(encoderShouldEmitUTF8Identifier: false)))
        {
            write(writer);
        }

        File.Move(temporary, full, overwrite: true);
    }

    private static string Caption(Request request, IndexSweepResult result) =>
        $"{(result.Number is int n ? $"Sweep {n}" : "Sweep (not stored)")} of {request.Index}" +
        (result.CatalogueRoot is null ? "" : $"; paths are relative to the catalogue root {result.CatalogueRoot}") +
        (request.NewOnly ? $"; only findings new since {(result.Previous is null ? "the start" : $"sweep {result.Previous.Number}")}" : "") + ".";

    private static object ToJson(Request request, IndexSweepResult result) => new
    {
        index = request.Index,
        catalogueRoot = result.CatalogueRoot,
        sweep = result.Number,
        stored = result.Stored,
        notStoredReason = result.Stored ? null : result.NotStoredReason,
        previousSweep = result.Previous?.Number,
        newOnly = request.NewOnly,
        newFindings = result.Report.Findings.Count(f => result.NewKeys.Contains(f.Key)),
        newFindingKeys = result.Report.Findings.Where(f => result.NewKeys.Contains(f.Key)).Select(f => f.Key),
        photosWithoutSku = result.PhotosWithoutSku,
        photosWithoutNode = result.PhotosWithoutNode,
        readSeconds = Math.Round(result.ReadTime.TotalSeconds, 3),
        sweepSeconds = Math.Round(result.SweepTime.TotalSeconds, 3),
        storeSeconds = Math.Round(result.StoreTime.TotalSeconds, 3),
        report = result.Report,
    };

    /// <summary>The parsed options of <c>lookup sweep</c>.</summary>
    internal sealed record Request(
        string Index,
        string? Report,
        string? Csv,
        bool Json,
        bool NewOnly,
        string FailOn,
        double StoreWait,
        bool NoStore,
        int Threads,
        bool Quiet);
}

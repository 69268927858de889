using System.CommandLine;
using System.Text.Json;
using Lookup.Store;

namespace Lookup.Cli;

/// <summary><c>lookup check --index FILE [--repair]</c>: verify an index and mend what needs no embedding.</summary>
internal static class CheckCommand
{
    private const int PathsShown = 20;

    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        WriteIndented = true,
        Converters = { new System.Text.Json.Serialization.JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
    };

    public static Command Create()
    {
        var index = IndexOption.Create();
        var repair = new Option<bool>("--repair")
        {
            Description = "Rebuild the graph from the stored vectors and drop what cannot be mended, in one transaction (needs the index free of other writers).",
        };
        var json = new Option<bool>("--json") { Description = "Print the findings (and the repair) as JSON on stdout." };
        var command = new Command(
            "check",
            """
            Verify an index: photo records against graph nodes (nodes no photo owns, photos whose node is retired,
            missing or shared), stored vectors (missing, wrong length, not unit length), link lists and the graph's
            integrity (reachability, link counts, entry point), retired nodes still linked, and the model fingerprint
            against the stored model card. Each finding says what to do. Without --repair the index is only read, so
            check runs beside an ingest.

            --repair rebuilds the graph from the stored vectors (nothing is embedded), leaves out retired and orphan
            nodes, and removes photo records whose vector is lost; the next ingest embeds those photos again. The
            repair is one transaction: if it is stopped, the file is as it was.

            Example:
              lookup check --index parts.lookup
              lookup check --index parts.lookup --repair --json

            Exit codes: 0 no errors (warnings may be listed; with --repair: none left after repairing), 1 errors
            found or left, or the index could not be opened, 2 usage error.
            """)
        {
            index, repair, json,
        };
        command.SetAction(parseResult => Run(
            parseResult.GetValue(index)!,
            parseResult.GetValue(repair),
            parseResult.GetValue(json),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error));
        return command;
    }

    internal static int Run(string indexPath, bool repair, bool json, TextWriter output, TextWriter error)
    {
        IndexCheckReport report;
        IndexRepairResult? repaired = null;
        try
        {
            using var file = IndexFile.Open(indexPath, repair ? IndexAccess.Write : IndexAccess.Read);
            if (repair)
            {
                repaired = IndexChecker.Repair(file);
                report = repaired.After;
            }
            else
            {
                report = IndexChecker.Check(file);
            }
        }
        catch (IndexFileException e)
        {
            error.WriteLine($"lookup check: {e.Message}");
            return ExitCodes.Failures;
        }

        if (json)
        {
            output.WriteLine(JsonSerializer.Serialize(ToJson(repaired?.Before ?? report, repaired), Json));
        }
        else
        {
            WriteText(repaired?.Before ?? report, repaired, output);
        }

        return report.IsHealthy ? ExitCodes.Success : ExitCodes.Failures;
    }

    private static void WriteText(IndexCheckReport report, IndexRepairResult? repaired, TextWriter output)
    {
        output.WriteLine($"index    {report.IndexPath}: {report.PhotoRecords:N0} photo records, {report.GraphNodes:N0} graph nodes ({report.LiveNodes:N0} live), {report.Links:N0} links");
        WriteFindings(report, output);
        if (repaired is null)
        {
            output.WriteLine(Verdict(report, repairAdvice: true));
            return;
        }

        if (!repaired.GraphRebuilt && repaired.RecordsDropped == 0)
        {
            output.WriteLine("repair   nothing to repair.");
            output.WriteLine(Verdict(report, repairAdvice: false));
            return;
        }

        if (repaired.GraphRebuilt)
        {
            output.WriteLine($"repair   graph rebuilt from the stored vectors: {repaired.NodesKept:N0} nodes kept, {repaired.NodesDropped:N0} left out (retired, orphaned or damaged).");
        }

        if (repaired.RecordsDropped > 0)
        {
            output.WriteLine($"repair   {repaired.RecordsDropped:N0} photo record(s) removed; the next ingest embeds those photos again:");
            foreach (string path in repaired.DroppedPaths.Take(PathsShown))
            {
                output.WriteLine($"         {path}");
            }

            if (repaired.DroppedPaths.Count > PathsShown)
            {
                output.WriteLine($"         … and {repaired.DroppedPaths.Count - PathsShown} more (all are listed with --json).");
            }
        }

        output.WriteLine("after repair:");
        WriteFindings(repaired.After, output);
        output.WriteLine(Verdict(repaired.After, repairAdvice: false));
    }

    private static void WriteFindings(IndexCheckReport report, TextWriter output)
    {
        foreach (var f in report.Findings)
        {
            output.WriteLine($"{(f.Severity == CheckSeverity.Error ? "ERROR" : "warning"),-8} {f.Code} ({f.Count:N0}): {f.Message}");
            output.WriteLine($"         fix: {f.Fix}");
        }
    }

    private static string Verdict(IndexCheckReport report, bool repairAdvice)
    {
        int errors = report.Findings.Count(f => f.Severity == CheckSeverity.Error);
        int warnings = report.Findings.Count - errors;
        if (errors == 0)
        {
            return warnings == 0 ? "result   clean." : $"result   no errors, {warnings} warning(s).";
        }

        string advice = repairAdvice && report.Findings.Any(f => f.Severity == CheckSeverity.Error && f.Repairable)
            ? $" Repairable ones: lookup check --index {report.IndexPath} --repair"
            : "";
        return $"result   {errors} error(s), {warnings} warning(s).{advice}";
    }

    private static object ToJson(IndexCheckReport report, IndexRepairResult? repaired) => new
    {
        index = report.IndexPath,
        report.PhotoRecords,
        report.GraphNodes,
        report.LiveNodes,
        report.Links,
        healthy = report.IsHealthy,
        report.Findings,
        repair = repaired is null ? null : new
        {
            repaired.GraphRebuilt,
            repaired.NodesKept,
            repaired.NodesDropped,
            repaired.RecordsDropped,
            repaired.DroppedPaths,
            after = new
            {
                healthy = repaired.After.IsHealthy,
                repaired.After.PhotoRecords,
                repaired.After.GraphNodes,
                repaired.After.LiveNodes,
                repaired.After.Findings,
            },
        },
    };
}

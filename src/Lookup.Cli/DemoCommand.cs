using System.CommandLine;
using System.Text.Json;
using Lookup.Cli.Output;
using Lookup.Demo;
using Lookup.Embedding;
using Lookup.Matching;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Cli;

/// <summary><c>lookup demo</c>: the whole job on the invented demo catalogue, checked against its truth file.</summary>
internal static partial class DemoCommand
{
    /// <summary>
    /// The tour matches bench snapshots, where the part is small on a busy bench: it searches the dense crop set
    /// (top-1 5/15 against 3/15 for the match default, DEVELOPERS.md section Matching) and says so.
    /// </summary>
    internal const CropSet TourCrops = CropSet.Dense;

    /// <summary>The report's file name when --report is not given (in the temporary folder).</summary>
    internal const string DefaultReportName = "lookup-demo-report.html";

    public static Command Create()
    {
        var catalogue = new Option<string?>("--catalogue")
        {
            Description = "The demo-catalogue folder; default: found in the current folder or above, or beside the program or above.",
        };
        var index = new Option<string?>("--index") { Description = "Build (or bring up to date) and keep this index file; default: a temporary index, deleted at the end." };
        var report = new Option<string?>("--report")
        {
            Description = $"Write the sweep's HTML page here; default: {DefaultReportName} in the temporary folder (the path is printed).",
        };
        var json = new Option<bool>("--json") { Description = "Print one JSON object instead of the tables." };
        var workers = new Option<int>("--workers") { Description = "Threads for indexing, matching and the sweep.", DefaultValueFactory = _ => Environment.ProcessorCount };
        var quiet = new Option<bool>("--quiet") { Description = "No progress on stderr." };
        var model = ModelOption.Create();
        var command = new Command(
            "demo",
            """
            A tour of the whole job on the invented demo catalogue (demo-catalogue/: 46 SKUs of small parts, 18 bench
            snapshots, a few planted filing mistakes): index the catalogue photos, match every bench snapshot the way
            lookup match does and compare the answers with the demo's truth file, sweep the index for duplicates and
            misfiled photos, write the HTML report and check every planted mistake was found. No network needed.

            Example:
              lookup demo
              lookup demo --catalogue ~/src/lookup/demo-catalogue --report tour.html
              lookup demo --index demo.lookup --json

            Exit codes: 0 the tour ran (accuracy and planted mistakes found are printed), 1 the demo folder, model or
            index could not be used or a photo failed, 2 usage error, 130 stopped by Ctrl+C.
            """)
        {
            catalogue, index, report, json, workers, quiet, model,
        };
        command.SetAction((parseResult, cancellationToken) => Task.FromResult(Run(
            new Request(
                parseResult.GetValue(catalogue),
                parseResult.GetValue(index),
                parseResult.GetValue(report),
                parseResult.GetValue(json),
                parseResult.GetValue(workers),
                parseResult.GetValue(quiet),
                parseResult.GetValue(model)),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error,
            cancellationToken)));
        return command;
    }

    internal static int Run(Request request, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        if (request.Workers < 1)
        {
            error.WriteLine($"lookup demo: --workers must be at least 1 (got {request.Workers}).");
            return ExitCodes.Usage;
        }

        if (Locate(request, error) is not { } folder)
        {
            return ExitCodes.Failures;
        }

        using var embedder = ModelOption.TryLoad(request.Model, "demo", error);
        if (embedder is null)
        {
            return ExitCodes.Failures;
        }

        var temporary = request.Index is null ? Path.Combine(Path.GetTempPath(), "lookup-demo-" + Guid.NewGuid().ToString("N")) : null;
        var indexPath = request.Index ?? Path.Combine(temporary!, "demo.lookup");
        var reportPath = Path.GetFullPath(request.Report ?? Path.Combine(Path.GetTempPath(), DefaultReportName));
        var progress = new SynchronousProgress<string>(stage =>
        {
            if (!request.Quiet)
            {
                error.WriteLine($"lookup demo: {stage} ...");
            }
        });
        using var stop = new StopSignal(cancellationToken);
        try
        {
            if (temporary is not null)
            {
                Directory.CreateDirectory(temporary);
            }

            var options = new DemoTourOptions { DemoFolder = folder, IndexPath = indexPath, Crops = TourCrops, Workers = request.Workers };
            var result = new DemoTour(embedder).Run(options, progress, stop.Token);
            progress.Report($"writing {reportPath}");
            SweepCommand.WriteHtmlReport(reportPath, result.Sweep, Caption(result), request.Workers, stop.Token);
            var shownIndex = temporary is null ? Path.GetFullPath(indexPath) : null;
            if (request.Json)
            {
                output.WriteLine(JsonSerializer.Serialize(ToJson(result, shownIndex, reportPath), SweepJsonWriter.Options));
            }
            else
            {
                WriteText(result, shownIndex, reportPath, output);
            }

            return result.Ingest.Failed > 0 || result.Field.Any(f => f.Failure is not null) ? ExitCodes.Failures : ExitCodes.Success;
        }
        catch (Exception e) when (e is DemoTruthException or IndexFileException or ModelLoadException)
        {
            error.WriteLine($"lookup demo: {e.Message}");
            return ExitCodes.Failures;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"lookup demo: could not write {reportPath} or the index: {e.Message} Give --report and --index in a writable folder.");
            return ExitCodes.Failures;
        }
        catch (OperationCanceledException) when (stop.Token.IsCancellationRequested)
        {
            error.WriteLine("lookup demo: stopped.");
            return ExitCodes.Interrupted;
        }
        finally
        {
            if (temporary is not null)
            {
                DeleteQuietly(temporary);
            }
        }
    }

    /// <summary>The demo folder: --catalogue, else found from the current folder or the program's folder.</summary>
    private static string? Locate(Request request, TextWriter error)
    {
        if (request.Catalogue is { } given)
        {
            if (DemoFolderLocator.IsDemoFolder(given))
            {
                return Path.GetFullPath(given);
            }

            error.WriteLine(
                $"lookup demo: {Path.GetFullPath(given)} is not the demo catalogue (it needs {DemoTruth.FileName} and {DemoTruth.PhotosFolder}/): " +
                $"give the {DemoFolderLocator.FolderName} folder of the repository.");
            return null;
        }

        var starts = new[] { Environment.CurrentDirectory, AppContext.BaseDirectory };
        if (DemoFolderLocator.Find(starts) is { } found)
        {
            return found;
        }

        error.WriteLine(
            $"lookup demo: no {DemoFolderLocator.FolderName} folder in {starts[0]} or any folder above it, nor beside the program " +
            $"({AppContext.BaseDirectory}) or above: run from a clone of the repository, or give --catalogue PATH/{DemoFolderLocator.FolderName}.");
        return null;
    }

    private static string Caption(DemoTourResult result) =>
        $"Demo sweep of the invented catalogue in {result.Options.DemoFolder}; paths are relative to {result.Sweep.CatalogueRoot}. " +
        $"The planted mistakes are listed in {DemoTruth.FileName}.";

    private static void DeleteQuietly(string folder)
    {
        try
        {
            Directory.Delete(folder, recursive: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Left for the system's temporary-file cleaning.
        }
    }

    /// <summary>The parsed options of <c>lookup demo</c>.</summary>
    internal sealed record Request(
        string? Catalogue,
        string? Index,
        string? Report,
        bool Json,
        int Workers,
        bool Quiet,
        string? Model);
}

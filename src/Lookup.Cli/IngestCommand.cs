using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Lookup.Catalogue;
using Lookup.Cli.Output;
using Lookup.Imaging;
using Lookup.Store;

namespace Lookup.Cli;

/// <summary><c>lookup ingest TREE --index FILE</c>: bring an index up to date with a photo tree.</summary>
internal static class IngestCommand
{
    private const int FailuresShown = 20;
    private const int DefaultBatchSize = 64;

    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        WriteIndented = true,
        Converters = { new System.Text.Json.Serialization.JsonStringEnumConverter() },
    };

    public static Command Create()
    {
        var tree = new Argument<string>("photo-tree") { Description = "The folder of catalogue photos." };
        var index = IndexOption.Create();
        var skuFrom = new Option<string>("--sku-from")
        {
            Description = "Where SKUs come from: folder (the photo's folder name), csv:FILE (file,sku rows) or pattern:REGEX (named group 'sku').",
            DefaultValueFactory = _ => "folder",
        };
        var workers = new Option<int>("--workers")
        {
            Description = "Worker threads, each reading, decoding and embedding whole photos.",
            DefaultValueFactory = _ => Environment.ProcessorCount,
        };
        var keepMissing = new Option<bool>("--keep-missing") { Description = "Keep photos whose files are gone instead of retiring them." };
        var retryFailed = new Option<bool>("--retry-failed") { Description = "Try again photos that failed before, even if unchanged." };
        var maxMegapixels = new Option<double>("--max-megapixels")
        {
            Description = "Refuse photos larger than this many megapixels (read from the header, before decoding).",
            DefaultValueFactory = _ => PhotoLimits.Default.MaxPixels / 1e6,
        };
        var maxDecodeSeconds = new Option<double>("--max-decode-seconds")
        {
            Description = "Give up on a photo whose decode takes longer than this many seconds (it is recorded as timed out).",
            DefaultValueFactory = _ => PhotoLimits.Default.DecodeTimeout.TotalSeconds,
        };
        var shard = new Option<string?>("--shard") { Description = "Process only shard K of N (K/N, 1-based), chosen by a hash of each photo's relative path." };
        var batchSize = new Option<int>("--batch-size")
        {
            Description = "Photos committed to the index per transaction; a stop or crash loses at most the batch in progress.",
            DefaultValueFactory = _ => DefaultBatchSize,
        };
        var json = new Option<bool>("--json") { Description = "Print the summary as JSON on stdout." };
        var quiet = new Option<bool>("--quiet") { Description = "No progress on stderr." };
        var model = ModelOption.Create();
        var command = new Command(
            "ingest",
            """
            Index a photo tree: new and changed photos are embedded, moved ones recognised by content, gone ones retired.
            An unchanged tree is re-read in seconds. Safe to stop (Ctrl+C commits what is done) and to re-run after a crash.

            Example:
              lookup ingest /srv/photos --index parts.lookup
              lookup ingest /srv/photos --index parts.lookup --sku-from csv:/srv/photos/skus.csv --json

            Exit codes: 0 all photos indexed, 1 some photos failed or got no SKU (listed) or the index could not
            be used, 2 usage error, 130 stopped by Ctrl+C or SIGTERM (what was done is kept; run again to finish).
            """)
        {
            tree, index, skuFrom, workers, keepMissing, retryFailed, maxMegapixels, maxDecodeSeconds, shard, batchSize, json, quiet, model,
        };
        command.SetAction((parseResult, cancellationToken) => Task.FromResult(Run(
            new IngestRequest(
                parseResult.GetValue(tree)!,
                parseResult.GetValue(index)!,
                parseResult.GetValue(skuFrom)!,
                parseResult.GetValue(workers),
                parseResult.GetValue(keepMissing),
                parseResult.GetValue(retryFailed),
                parseResult.GetValue(maxMegapixels),
                parseResult.GetValue(maxDecodeSeconds),
                parseResult.GetValue(shard),
                parseResult.GetValue(batchSize),
                parseResult.GetValue(json),
                parseResult.GetValue(quiet),
                parseResult.GetValue(model)),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error,
            cancellationToken)));
        return command;
    }

    internal static int Run(IngestRequest request, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        if (request.Workers < 1 || request.MaxMegapixels <= 0 || request.BatchSize < 1 || !(request.MaxDecodeSeconds is > 0 and <= 86_400))
        {
            error.WriteLine("lookup ingest: --workers and --batch-size must be at least 1, --max-megapixels above 0 and --max-decode-seconds between 0 and 86400.");
            return ExitCodes.Usage;
        }

        ShardSpec? shard = null;
        if (request.Shard is not null)
        {
            try
            {
                shard = ShardSpec.Parse(request.Shard);
            }
            catch (FormatException e)
            {
                error.WriteLine($"lookup ingest: {e.Message}");
                return ExitCodes.Usage;
            }
        }

        if (!Directory.Exists(request.Tree))
        {
            error.WriteLine($"lookup ingest: {request.Tree} is not a folder; give the folder that holds the catalogue photos.");
            return ExitCodes.Usage;
        }

        // Checked before the model loads and the index is created: a mistyped spec or CSV path costs nothing.
        if (!SkuMapping.TryParse(request.SkuFrom, Environment.CurrentDirectory, out _, out string? mappingError))
        {
            error.WriteLine($"lookup ingest: --sku-from: {mappingError}");
            return ExitCodes.Usage;
        }

        using var embedder = ModelOption.TryLoad(request.Model, "ingest", error);
        if (embedder is null)
        {
            return ExitCodes.Failures;
        }

        var options = new IngestOptions
        {
            Root = request.Tree,
            SkuMapping = request.SkuFrom,
            Workers = request.Workers,
            KeepMissing = request.KeepMissing,
            RetryFailed = request.RetryFailed,
            Limits = PhotoLimits.Default with
            {
                MaxPixels = (long)(request.MaxMegapixels * 1e6),
                DecodeTimeout = TimeSpan.FromSeconds(request.MaxDecodeSeconds),
            },
            Shard = shard,
            BatchSize = request.BatchSize,
        };
        var progressLine = new ProgressLine(error, request.Quiet);
        IngestSummary summary;
        using var stop = new StopSignal(cancellationToken);
        try
        {
            using var file = IndexFile.Open(request.Index, IndexAccess.Write);
            var progress = new SynchronousProgress<IngestProgress>(p => progressLine.Report(p.Stage, p.Done, p.Total, p.Failed, p.Total > 0 && p.Done == p.Total));
            summary = new CatalogueIngest(file, embedder).Run(options, progress, stop.Token);
        }
        catch (Exception e) when (e is IndexFileException or SkuMappingException)
        {
            progressLine.Finish();
            error.WriteLine($"lookup ingest: {e.Message}");
            return ExitCodes.Failures;
        }
        catch (OperationCanceledException) when (stop.Token.IsCancellationRequested)
        {
            progressLine.Finish();
            error.WriteLine($"lookup ingest: stopped while scanning and planning, before any photo was embedded; {request.Index} is as it was. Run the same command again.");
            return ExitCodes.Interrupted;
        }
        catch (LiteDB.LiteException e)
        {
            progressLine.Finish();
            error.WriteLine(
                $"lookup ingest: {request.Index} could not be read or written ({e.Message}): the file looks damaged. Batches committed " +
                $"before this are kept. Run 'lookup check --index {request.Index}' to see what is wrong and whether --repair can mend it; " +
                "otherwise restore it from a backup or ingest the catalogue into a new index file.");
            return ExitCodes.Failures;
        }
        catch (IOException e)
        {
            progressLine.Finish();
            error.WriteLine(
                $"lookup ingest: writing {request.Index} failed: {e.Message} Every batch committed before the failure is kept and the " +
                "batch being written was rolled back. Free disk space (or fix what the message names) and run the same command " +
                "again: it carries on where this run stopped, embedding nothing twice.");
            return ExitCodes.Failures;
        }

        progressLine.Finish();
        if (request.Json)
        {
            output.WriteLine(JsonSerializer.Serialize(ToJson(summary, request), Json));
        }
        else
        {
            WriteText(summary, request, output);
        }

        return summary.Cancelled ? ExitCodes.Interrupted
            : summary.Failed > 0 || summary.MappingProblems.Any(p => p.Severity == ProblemSeverity.Error) ? ExitCodes.Failures
            : ExitCodes.Success;
    }

    private static void WriteText(IngestSummary s, IngestRequest request, TextWriter output)
    {
        var table = new TextTable("new", "changed", "unchanged", "moved", "updated", "retired", "failed", "unmapped", "time", "rate")
            .AlignRight(0, 1, 2, 3, 4, 5, 6, 7, 8, 9);
        table.Add(s.New, s.Changed, s.Unchanged, s.Moved, s.Updated, s.Retired, s.Failed, s.Unmapped,
            ProgressLine.FormatDuration(s.Elapsed), string.Create(CultureInfo.InvariantCulture, $"{s.PhotosPerSecond:0.0}/s"));
        output.Write(table.ToString());
        output.WriteLine($"{request.Index}: {s.IndexedTotal} photos indexed.{(s.Cancelled ? " Stopped early: run the same command again to finish." : "")}");
        if (s.OtherShards > 0)
        {
            output.WriteLine($"{s.OtherShards} photos belong to other shards and were left to them.");
        }

        foreach (var failure in s.Failures.Take(FailuresShown))
        {
            output.WriteLine($"failed  {failure.Path}: {failure.Message}");
        }

        if (s.Failures.Count > FailuresShown)
        {
            output.WriteLine($"… and {s.Failures.Count - FailuresShown} more failures (all are listed with --json).");
        }

        foreach (var problem in s.MappingProblems.Take(FailuresShown))
        {
            output.WriteLine($"sku     {problem.Message}");
        }

        foreach (var problem in s.ScanProblems.Take(FailuresShown))
        {
            output.WriteLine($"scan    {problem.Message}");
        }
    }

    private static object ToJson(IngestSummary s, IngestRequest request) => new
    {
        index = request.Index,
        s.Scanned,
        s.New,
        s.Changed,
        s.Unchanged,
        s.Moved,
        s.Updated,
        s.Retired,
        s.KeptMissing,
        s.Failed,
        s.Unmapped,
        s.OtherShards,
        s.Embedded,
        s.IndexedTotal,
        elapsedSeconds = Math.Round(s.Elapsed.TotalSeconds, 3),
        photosPerSecond = Math.Round(s.PhotosPerSecond, 2),
        s.Cancelled,
        failures = s.Failures,
        mappingProblems = s.MappingProblems.Select(p => new { kind = p.Kind.ToString(), severity = p.Severity.ToString(), p.Path, p.Line, p.Message }),
        scanProblems = s.ScanProblems.Select(p => new { kind = p.Kind.ToString(), path = p.RelativePath, p.Message }),
    };
}

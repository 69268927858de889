using System.CommandLine;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Matching;
using Lookup.Store;

namespace Lookup.Cli;

/// <summary><c>lookup match PHOTO... --index FILE</c>: which SKUs a photo of a part shows, nearest first, with a verdict.</summary>
internal static class MatchCommand
{
    /// <summary>
    /// The crop set used when --crops is not given: the most accurate set whose whole-process time on a
    /// 100,000-photo index stays within the 1.5 s target on two idle cores (standard 1.44 s, dense 2.22 s; measured in
    /// DEVELOPERS.md, section Matching).
    /// </summary>
    internal const CropSet DefaultCrops = CropSet.Standard;

    private const int MaxTop = 100;

    public static Command Create()
    {
        var photos = new Argument<string[]>("photo")
        {
            Description = "Photos of one part (fused into one ranking) or, with --each, of several parts.",
            Arity = ArgumentArity.ZeroOrMore,
        };
        var index = IndexOption.Create();
        var top = new Option<int>("--top") { Description = $"How many SKUs to list (1–{MaxTop}).", DefaultValueFactory = _ => 5 };
        var crops = new Option<CropSet>("--crops")
        {
            Description = "Regions of each photo to search with: none (whole photo), standard (+5 crops at 0.7 of the short side), dense (+ a 3 × 3 grid at 0.45).",
            DefaultValueFactory = _ => DefaultCrops,
        };
        var each = new Option<bool>("--each") { Description = "One ranking per photo instead of one for all photos." };
        var like = new Option<string?>("--like")
        {
            Description = "Query with an indexed photo (path relative to the catalogue root) or every photo of a SKU, using the stored vectors; the query's own photos are left out.",
        };
        var json = new Option<bool>("--json") { Description = "Print one JSON object instead of the tables." };
        var csv = new Option<bool>("--csv") { Description = "Print CSV rows (one per SKU per answer) instead of the tables." };
        var workers = new Option<int>("--workers")
        {
            Description = "Threads for embedding crops and searching.",
            DefaultValueFactory = _ => Environment.ProcessorCount,
        };
        var model = ModelOption.Create();
        var command = new Command(
            "match",
            """
            Find the SKUs a photo of a part shows: each photo is searched whole and in crops, every SKU is scored by
            its nearest photo, and the nearest SKUs are listed with a verdict: same file, same photo, same part,
            unsure (another SKU is about as close) or no match. Several photos of one part are fused into one ranking.

            Example:
              lookup match snapshot.jpg --index parts.lookup
              lookup match front.jpg side.jpg --index parts.lookup --top 3 --json
              lookup match field/*.jpg --index parts.lookup --each --csv
              lookup match --like HB-M8x40-ZN --index parts.lookup

            A visual match is not verification: check the part number, dimensions and rating before fitting anything
            safety-critical, and follow local codes and licensed practice.

            Exit codes: 0 answered (also when the answer is no match), 1 a photo could not be used or the index or
            model could not be (reason on stderr; the other photos are still answered), 2 usage error.
            """)
        {
            photos, index, top, crops, each, like, json, csv, workers, model,
        };
        command.SetAction(parseResult => Run(
            new MatchOptions(
                parseResult.GetValue(photos) ?? [],
                parseResult.GetValue(index)!,
                parseResult.GetValue(top),
                parseResult.GetValue(crops),
                parseResult.GetValue(each),
                parseResult.GetValue(like),
                parseResult.GetValue(json),
                parseResult.GetValue(csv),
                parseResult.GetValue(workers),
                parseResult.GetValue(model)),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error));
        return command;
    }

    internal static int Run(MatchOptions options, TextWriter output, TextWriter error)
    {
        if (UsageProblem(options) is { } problem)
        {
            error.WriteLine($"lookup match: {problem}");
            return ExitCodes.Usage;
        }

        // The network takes longest to load; it loads while the index is opened and the photos are decoded.
        var loading = options.Like is null ? Task.Run(() => LoadModel(options)) : null;
        try
        {
            MatchRun run;
            MatchIndex matchIndex;
            try
            {
                matchIndex = MatchIndex.Open(options.Index);
            }
            catch (IndexFileException e)
            {
                error.WriteLine($"lookup match: {e.Message}");
                return ExitCodes.Failures;
            }

            using (matchIndex)
            {
                var request = new MatchRequest(options.Top, options.Crops, options.Each, options.Workers);
                var matcher = new PartMatcher(matchIndex, new PhotoDecoder());
                try
                {
                    run = options.Like is { } target
                        ? matcher.MatchLike(LikeQuery.Resolve(matchIndex, target), request)
                        : matcher.MatchFiles(options.Photos, request, () => loading!.GetAwaiter().GetResult());
                }
                catch (Exception e) when (e is IndexFileException or ModelLoadException or LikeTargetException)
                {
                    error.WriteLine($"lookup match: {e.Message}");
                    return ExitCodes.Failures;
                }

                foreach (var failure in run.Failures)
                {
                    error.WriteLine($"lookup match: {failure.Message}");
                }

                var report = new MatchReport(matchIndex.Path, options, matchIndex.Thresholds, run);
                if (options.Json)
                {
                    MatchJsonWriter.Write(report, output);
                }
                else if (options.Csv)
                {
                    MatchCsvWriter.Write(report, output);
                    error.WriteLine(MatchCaution.Text);
                }
                else
                {
                    MatchTextWriter.Write(report, output);
                }
            }

            return run.Failures.Count > 0 ? ExitCodes.Failures : ExitCodes.Success;
        }
        finally
        {
            DisposeModel(loading);
        }
    }

    private static string? UsageProblem(MatchOptions o)
    {
        if (o.Top is < 1 or > MaxTop)
        {
            return $"--top must be between 1 and {MaxTop} (got {o.Top}).";
        }

        if (o.Workers < 1)
        {
            return $"--workers must be at least 1 (got {o.Workers}).";
        }

        if (o.Json && o.Csv)
        {
            return "choose one of --json and --csv.";
        }

        if (o.Like is not null)
        {
            return o.Photos.Count > 0 ? "give either photos or --like, not both."
                : o.Each ? "--each applies to photo files, not to --like." : null;
        }

        return o.Photos.Count == 0 ? "give at least one photo, or --like PATH|SKU (see lookup match --help)." : null;
    }

    /// <summary>One intra-op thread per call when the crops keep every worker busy; otherwise let one run use the cores.</summary>
    private static ImageEmbedder LoadModel(MatchOptions options)
    {
        var card = options.Model is null ? ModelCard.Default : ModelCard.Load(options.Model);
        int runs = options.Photos.Count * QueryCrops.Count(options.Crops);
        int threads = runs >= options.Workers ? 1 : options.Workers;
        return ImageEmbedder.Load(card, new EmbedderOptions { IntraOpThreads = threads });
    }

    private static void DisposeModel(Task<ImageEmbedder>? loading)
    {
        if (loading is null)
        {
            return;
        }

        try
        {
            loading.GetAwaiter().GetResult().Dispose();
        }
        catch (ModelLoadException)
        {
            // Already reported if it mattered; nothing to dispose.
        }
    }
}

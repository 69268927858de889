using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Lookup.Calibration;
using Lookup.Cli.Output;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Cli;

/// <summary><c>lookup calibrate --index FILE</c>: measure the verdict thresholds on the catalogue itself and store them.</summary>
internal static class CalibrateCommand
{
    private static readonly JsonSerializerOptions Json = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        WriteIndented = true,
        Converters = { new System.Text.Json.Serialization.JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
    };

    public static Command Create()
    {
        var defaults = new CalibrationOptions();
        var index = IndexOption.Create();
        var sample = new Option<int>("--sample") { Description = "Catalogue photos to make edited copies of (8 copies each, one embedding per copy).", DefaultValueFactory = _ => defaults.SampleSize };
        var seed = new Option<int>("--seed") { Description = "Seed of every random choice; the same index and seed give the same thresholds.", DefaultValueFactory = _ => defaults.Seed };
        var target = new Option<double>("--target-false-match")
        {
            Description = "Share of stranger pairs (photos of different SKUs) allowed inside the copy band; the same-part band allows ten times as many.",
            DefaultValueFactory = _ => defaults.TargetFalseMatchRate,
        };
        var plot = new Option<string?>("--plot") { Description = "Also write the distance histograms with the chosen limits as a PNG file." };
        var plotSize = new Option<string>("--plot-size") { Description = "Size of the plot in pixels, WIDTHxHEIGHT.", DefaultValueFactory = _ => $"{CalibrationPlot.DefaultWidth}x{CalibrationPlot.DefaultHeight}" };
        var workers = new Option<int>("--workers") { Description = "Threads making and embedding copies.", DefaultValueFactory = _ => Environment.ProcessorCount };
        var json = new Option<bool>("--json") { Description = "Print the result as JSON on stdout." };
        var quiet = new Option<bool>("--quiet") { Description = "No progress on stderr." };
        var model = new Option<string?>("--model") { Description = "The model card the index was built with, when the stored one cannot be used; another model is refused." };
        var command = new Command(
            "calibrate",
            """
            Measure the verdict thresholds on this catalogue and store them in the index. Sampled photos are edited into
            true copies in memory (JPEG re-saves, shrinking, crops of 60-90 %, tone and colour casts, mirror, small turns,
            web exports) and embedded; stored embeddings give strangers (different SKUs) and siblings (other photos of one
            SKU). The limits are fitted on half of the SKUs and measured on the other half, and printed with the measured
            rates. Needs at least 20 indexed photos under 4 SKUs; 300 photos take a few minutes on 2 cores.

            Example:
              lookup calibrate --index parts.lookup
              lookup calibrate --index parts.lookup --sample 500 --plot calibration.png --json

            Exit codes: 0 thresholds stored, 1 calibration not possible (reason on stderr: missing index, too few photos
            or SKUs, catalogue folder missing, other model, index busy), 2 usage error, 130 stopped by Ctrl+C (nothing stored).
            """)
        {
            index, sample, seed, target, plot, plotSize, workers, json, quiet, model,
        };
        command.SetAction((parseResult, cancellationToken) => Task.FromResult(Run(
            new Request(
                parseResult.GetValue(index)!,
                parseResult.GetValue(sample),
                parseResult.GetValue(seed),
                parseResult.GetValue(target),
                parseResult.GetValue(plot),
                parseResult.GetValue(plotSize)!,
                parseResult.GetValue(workers),
                parseResult.GetValue(json),
                parseResult.GetValue(quiet),
                parseResult.GetValue(model)),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error,
            cancellationToken)));
        return command;
    }

    private static int Run(Request request, TextWriter output, TextWriter error, CancellationToken cancellationToken)
    {
        if (request.Sample < 1 || request.Workers < 1 || !(request.Target is > 0 and <= 0.1))
        {
            error.WriteLine("lookup calibrate: --sample and --workers must be at least 1, and --target-false-match must lie in (0, 0.1] (0.001 is 0.1 %).");
            return ExitCodes.Usage;
        }

        if (!TryParseSize(request.PlotSize, out int plotWidth, out int plotHeight))
        {
            error.WriteLine($"lookup calibrate: --plot-size '{request.PlotSize}' is not WIDTHxHEIGHT with sides from {CalibrationPlot.MinWidth}x{CalibrationPlot.MinHeight} to {CalibrationPlot.MaxSide}x{CalibrationPlot.MaxSide} (for example 960x540).");
            return ExitCodes.Usage;
        }

        var options = new CalibrationOptions { SampleSize = request.Sample, Seed = request.Seed, TargetFalseMatchRate = request.Target, Workers = request.Workers };
        CalibrationInput input;
        ModelCard card;
        try
        {
            using (var file = IndexFile.Open(request.Index, IndexAccess.Read))
            {
                input = CalibrationInput.Read(file);
                card = IndexModelCard.Resolve(CatalogueSettings.Read(file)!, request.Model);
            }

            input.CheckUsable(options);
            input.CheckModel(ModelFingerprint.Compute(card), card.Name);
        }
        catch (Exception e) when (e is IndexFileException or CalibrationException or ModelLoadException)
        {
            error.WriteLine($"lookup calibrate: {e.Message}");
            return ExitCodes.Failures;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"lookup calibrate: a model file named by the card cannot be read ({e.Message}); give the card {request.Index} was built with (--model).");
            return ExitCodes.Failures;
        }

        CalibrationResult result;
        var progressLine = new ProgressLine(error, request.Quiet);
        try
        {
            using var embedder = ImageEmbedder.Load(card);
            var progress = new SynchronousProgress<CalibrationProgress>(p => progressLine.Report(p.Stage, p.Done, p.Total, p.Skipped, force: p.Done == 0 || p.Done == p.Total));
            result = new Calibrator(embedder, new PhotoDecoder()).Run(input, options, progress, cancellationToken);
        }
        catch (Exception e) when (e is CalibrationException or ModelLoadException)
        {
            progressLine.Finish();
            error.WriteLine($"lookup calibrate: {e.Message}");
            return ExitCodes.Failures;
        }
        catch (OperationCanceledException)
        {
            progressLine.Finish();
            error.WriteLine("lookup calibrate: stopped; nothing was stored, the thresholds in the index are unchanged.");
            return ExitCodes.Interrupted;
        }

        progressLine.Finish();
        try
        {
            using var file = IndexFile.Open(request.Index, IndexAccess.Write);
            result.Store(file);
        }
        catch (IndexFileException e)
        {
            error.WriteLine($"lookup calibrate: the thresholds were measured but not stored: {e.Message}");
            return ExitCodes.Failures;
        }

        if (request.Plot is not null)
        {
            try
            {
                File.WriteAllBytes(request.Plot, CalibrationPlot.RenderPng(CalibrationRecord.From(result), plotWidth, plotHeight));
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                error.WriteLine($"lookup calibrate: the thresholds are stored, but the plot could not be written to {request.Plot} ({e.Message}); check the folder exists and is writable.");
                return ExitCodes.Failures;
            }
        }

        if (request.Json)
        {
            output.WriteLine(JsonSerializer.Serialize(ToJson(result, request, plotWidth, plotHeight), Json));
        }
        else
        {
            WriteText(result, request, input, card, plotWidth, plotHeight, output);
        }

        return ExitCodes.Success;
    }

    private static void WriteText(CalibrationResult r, Request request, CalibrationInput input, ModelCard card, int plotWidth, int plotHeight, TextWriter output)
    {
        var t = r.Thresholds;
        var m = r.Measured;
        output.WriteLine(F($"Calibrated {request.Index}: {r.Photos:N0} photos under {r.Skus:N0} SKUs, model {card.Name} ({IndexModelCard.Short(input.ModelFingerprint)})."));
        output.WriteLine(F($"{r.PhotosSampled:N0} photos sampled (seed {r.Options.Seed}), {r.Copies:N0} copies made; limits fitted on {r.FitSkus:N0} SKUs ({r.FitCopies:N0} copies, {r.FitStrangerPairs:N0} stranger pairs), measured on the other {r.HeldOutSkus:N0}."));
        output.WriteLine("Shares below are of the held-out half, counting pairs at or below each limit:");
        output.WriteLine();
        var bands = new TextTable("band", "distance", "copies caught", "strangers inside", "target", "siblings inside").AlignRight(2, 3, 4, 5);
        bands.Add("copy", F($"≤ {t.Copy:0.000}"), Share(m.CopiesInCopyBand), Share(m.StrangersInCopyBand), Pct(r.Options.TargetFalseMatchRate), Share(m.SiblingsInCopyBand));
        bands.Add("same part", F($"≤ {t.SamePart:0.000}"), Share(m.CopiesInSamePartBand), Share(m.StrangersInSamePartBand), Pct(r.Options.SamePartFalseMatchRate), Share(m.SiblingsInSamePartBand));
        bands.Add("no match", F($"> {t.SamePart:0.000}"), "", "", "", "");
        output.Write(bands.ToString());
        output.WriteLine($"Copy band set by {CopySetBy(r)}; same-part band by {SamePartSetBy(r)}.");
        output.WriteLine();

        var edits = new TextTable("copies by edit (held out)", "caught", "median", "max").AlignRight(1, 2, 3);
        foreach (var e in m.ByEdit)
        {
            edits.Add(EditName(e.Kind), Share(e.InCopyBand), e.Median, e.Max);
        }

        output.Write(edits.ToString());
        output.WriteLine();
        output.WriteLine(F($"Stored in {request.Index}: copy ≤ {t.Copy:0.000}, same part ≤ {t.SamePart:0.000}, margin {t.MinMargin:0.00} (calibrated {t.CalibratedUtc:yyyy-MM-dd HH:mm} UTC, {ProgressLine.FormatDuration(r.Elapsed)})."));
        if (request.Plot is not null)
        {
            output.WriteLine($"Plot: {request.Plot} ({plotWidth} × {plotHeight}).");
        }

        foreach (var skipped in r.Skipped.Take(10))
        {
            output.WriteLine($"skipped  {skipped.Path}: {skipped.Reason}");
        }

        foreach (var warning in r.Warnings)
        {
            output.WriteLine($"warning  {warning}");
        }

        output.WriteLine(Verdicts.SafetyNotice);
    }

    private static string CopySetBy(CalibrationResult r) => r.Limits.CopySetBy == BandLimit.CopyCoverage
        ? F($"covering {Pct(r.Options.CopyCoverage)} of the fitted copies (the {Pct(r.Options.TargetFalseMatchRate)} stranger target alone would allow {r.Limits.StrangerLimitAtTarget:0.000})")
        : F($"the {Pct(r.Options.TargetFalseMatchRate)} stranger target (covering {Pct(r.Options.CopyCoverage)} of the fitted copies would need {r.Limits.CopyCoverageLimit:0.000})");

    private static string SamePartSetBy(CalibrationResult r) => r.Limits.SamePartSetBy == BandLimit.StrangerRate
        ? $"the {Pct(r.Options.SamePartFalseMatchRate)} stranger rate"
        : "the copy band (strangers reach the same-part rate before it ends)";

    private static string EditName(CopyEditKind kind) => kind switch
    {
        CopyEditKind.Recompress => "JPEG re-save q25-60",
        CopyEditKind.Downscale => "shrink to 20-60 %",
        CopyEditKind.Crop => "crop 60-90 % per side",
        CopyEditKind.Tone => "brightness and contrast",
        CopyEditKind.WhiteBalance => "colour cast",
        CopyEditKind.Mirror => "mirror",
        CopyEditKind.Straighten => "straighten 1-6°",
        _ => "web export",
    };

    private static string Share(RateCount rate) => rate.Total == 0 ? "-" : F($"{Pct(rate.Rate)} ({rate.Inside:N0}/{rate.Total:N0})");

    private static string Pct(double rate) => rate.ToString(rate > 0 && rate < 0.01 ? "0.00 %" : "0.0 %", CultureInfo.InvariantCulture);

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);

    internal static bool TryParseSize(string text, out int width, out int height)
    {
        width = height = 0;
        var parts = text.Split('x', 'X', '×');
        return parts.Length == 2
            && int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out width)
            && int.TryParse(parts[1], NumberStyles.None, CultureInfo.InvariantCulture, out height)
            && width is >= CalibrationPlot.MinWidth and <= CalibrationPlot.MaxSide
            && height is >= CalibrationPlot.MinHeight and <= CalibrationPlot.MaxSide;
    }

    private static object ToJson(CalibrationResult r, Request request, int plotWidth, int plotHeight) => new
    {
        index = request.Index,
        stored = true,
        thresholds = r.Thresholds,
        copySetBy = r.Limits.CopySetBy,
        samePartSetBy = r.Limits.SamePartSetBy,
        strangerLimitAtTarget = r.Limits.StrangerLimitAtTarget,
        strangerLimitAtSamePartRate = r.Limits.StrangerLimitAtSamePartRate,
        copyCoverageLimit = float.IsFinite(r.Limits.CopyCoverageLimit) ? r.Limits.CopyCoverageLimit : (float?)null,
        targetFalseMatchRate = r.Options.TargetFalseMatchRate,
        samePartFalseMatchRate = r.Options.SamePartFalseMatchRate,
        copyCoverage = r.Options.CopyCoverage,
        seed = r.Options.Seed,
        heldOut = new
        {
            copiesInCopyBand = Rate(r.Measured.CopiesInCopyBand),
            copiesInSamePartBand = Rate(r.Measured.CopiesInSamePartBand),
            strangersInCopyBand = Rate(r.Measured.StrangersInCopyBand),
            strangersInSamePartBand = Rate(r.Measured.StrangersInSamePartBand),
            siblingsInCopyBand = Rate(r.Measured.SiblingsInCopyBand),
            siblingsInSamePartBand = Rate(r.Measured.SiblingsInSamePartBand),
            byEdit = r.Measured.ByEdit.Select(e => new { edit = e.Kind, inCopyBand = Rate(e.InCopyBand), inSamePartBand = Rate(e.InSamePartBand), median = e.Median, max = e.Max }),
        },
        photos = r.Photos,
        skus = r.Skus,
        skusWithSiblings = r.SkusWithSiblings,
        fitSkus = r.FitSkus,
        heldOutSkus = r.HeldOutSkus,
        photosSampled = r.PhotosSampled,
        copies = r.Copies,
        fitCopies = r.FitCopies,
        fitSiblingPairs = r.FitSiblingPairs,
        fitStrangerPairs = r.FitStrangerPairs,
        skipped = r.Skipped,
        warnings = r.Warnings,
        plot = request.Plot is null ? null : new { path = request.Plot, width = plotWidth, height = plotHeight },
        elapsedSeconds = Math.Round(r.Elapsed.TotalSeconds, 2),
        notice = Verdicts.SafetyNotice,
    };

    private static object Rate(RateCount rate) => new { inside = rate.Inside, total = rate.Total, rate = rate.Rate, upper95 = rate.Upper95 };

    private sealed record Request(string Index, int Sample, int Seed, double Target, string? Plot, string PlotSize, int Workers, bool Json, bool Quiet, string? Model);
}

using System.Globalization;
using Lookup.Cli.Output;
using Lookup.Demo;
using Lookup.Matching;
using Lookup.Sweeps;

namespace Lookup.Cli;

/// <summary>The tour as text and as JSON: field photos against the truth, the planted mistakes, the caution and what next.</summary>
internal static partial class DemoCommand
{
    /// <summary>The commands to run on one's own photos, in order.</summary>
    internal static IReadOnlyList<(string Command, string Why)> NextSteps { get; } =
    [
        ("lookup ingest PHOTO-FOLDER --index parts.lookup", "index your catalogue (one sub-folder per SKU, or --sku-from csv:FILE)"),
        ("lookup calibrate --index parts.lookup", "measure the verdict distances on your own photos"),
        ("lookup match SNAPSHOT.jpg --index parts.lookup --crops dense", "which SKU a photo of a part shows (dense: small parts on a busy bench)"),
        ("lookup sweep --index parts.lookup --report sweep.html", "duplicates and misfiled photos in your catalogue"),
    ];

    private static void WriteText(DemoTourResult result, string? keptIndex, string reportPath, TextWriter output)
    {
        var ingest = result.Ingest;
        output.WriteLine($"Demo catalogue: {result.Options.DemoFolder} (an invented supplier; see its README.md).");
        output.WriteLine(Invariant(
            $"1. Indexed {ingest.IndexedTotal} catalogue photos ({ingest.Embedded} embedded, {ingest.Unchanged} unchanged, {ingest.Failed} failed) in {result.IngestTime.TotalSeconds:0.0} s") +
            Invariant($"{(keptIndex is null ? " into a temporary index" : $" into {keptIndex}")}."));
        output.WriteLine(Invariant($"2. Matched {result.Field.Count} bench snapshots in {result.MatchTime.TotalSeconds:0.0} s, each on its own as lookup match --crops dense answers it:"));
        var table = new TextTable("photo", "true SKU", "top SKU", "distance", "verdict", "right", "in top 3").AlignRight(3);
        foreach (var f in result.Field)
        {
            table.Add(
                Path.GetFileName(f.Photo.File),
                f.Photo.Sku ?? "(not stocked)",
                f.Failure is null ? f.Top?.Sku ?? "-" : "(failed)",
                f.Top is { } top ? top.Distance.ToString("0.0000", CultureInfo.InvariantCulture) : "",
                VerdictNames.Of(f.Verdict),
                f.Right ? "right" : "wrong",
                f.InTopThree switch { true => "yes", false => "no", null => "-" });
        }

        output.Write(table.ToString());
        foreach (var f in result.Field.Where(f => f.Failure is not null))
        {
            output.WriteLine($"failed  {f.Failure}");
        }

        output.WriteLine(Invariant(
            $"Top-1: {result.TopOneRight} of {result.Stocked} stocked parts right ({result.TopOneAccuracy:P0}); ") +
            Invariant($"top-3: {result.TopThreeRight} of {result.Stocked} ({result.TopThreeAccuracy:P0}); ") +
            Invariant($"not stocked: {result.NotStockedRight} of {result.Field.Count - result.Stocked} answered no match."));
        output.WriteLine("Look-alikes (M8 or M10, zinc or black) are meant to be hard: an unsure answer lists the SKUs to compare.");

        var findings = result.Sweep.Report.FindingsByKind.Where(k => k.Value > 0).Select(k => $"{k.Value} {Lower(FindingKindText.Label(k.Key))}");
        output.WriteLine(Invariant(
            $"3. Swept the index in {result.SweepTime.TotalSeconds:0.0} s: {result.Sweep.Report.Findings.Count} findings ({string.Join(", ", findings)})."));
        output.WriteLine($"   Report: {reportPath}");
        output.WriteLine("4. Planted mistakes (truth.json) against the sweep:");
        var defects = new TextTable("mistake", "photos", "found", "finding");
        foreach (var d in result.Defects)
        {
            defects.Add(
                d.Defect.Kind,
                string.Join(", ", d.Defect.Files.Select(Path.GetFileName)),
                d.Found ? "found" : "MISSED",
                d.Finding is { } finding ? $"#{d.FindingNumber} {Lower(FindingKindText.Label(finding.Kind))}" : d.Defect.Note);
        }

        output.Write(defects.ToString());
        output.WriteLine($"{result.DefectsFound} of {result.Defects.Count} planted mistakes found.");
        output.WriteLine();
        output.WriteLine(MatchCaution.Text);
        output.WriteLine();
        output.WriteLine("Next, on your own photos:");
        var width = NextSteps.Max(s => s.Command.Length);
        foreach (var (command, why) in NextSteps)
        {
            output.WriteLine($"  {command.PadRight(width)}  # {why}");
        }
    }

    private static object ToJson(DemoTourResult result, string? keptIndex, string reportPath) => new
    {
        demoFolder = result.Options.DemoFolder,
        index = keptIndex,
        report = reportPath,
        ingest = new
        {
            result.Ingest.IndexedTotal,
            result.Ingest.Embedded,
            result.Ingest.Unchanged,
            result.Ingest.Failed,
            seconds = Math.Round(result.IngestTime.TotalSeconds, 3),
        },
        field = result.Field.Select(f => new
        {
            photo = f.Photo.File,
            trueSku = f.Photo.Sku,
            f.Photo.Description,
            verdict = VerdictNames.Of(f.Verdict),
            f.Right,
            inTopThree = f.InTopThree,
            f.Failure,
            ranking = f.Ranking.Select(r => new { r.Rank, r.Sku, distance = Math.Round(r.Distance, 5), verdict = VerdictNames.Of(r.Verdict), r.BestPhoto }),
        }),
        accuracy = new
        {
            result.Stocked,
            topOneRight = result.TopOneRight,
            topThreeRight = result.TopThreeRight,
            topOne = Math.Round(result.TopOneAccuracy, 4),
            topThree = Math.Round(result.TopThreeAccuracy, 4),
            notStocked = result.Field.Count - result.Stocked,
            notStockedNoMatch = result.NotStockedRight,
        },
        matchSeconds = Math.Round(result.MatchTime.TotalSeconds, 3),
        sweep = new
        {
            findings = result.Sweep.Report.Findings.Count,
            byKind = result.Sweep.Report.FindingsByKind.ToDictionary(k => FindingKindText.Code(k.Key), k => k.Value),
            seconds = Math.Round(result.SweepTime.TotalSeconds, 3),
        },
        defects = result.Defects.Select(d => new
        {
            d.Defect.Kind,
            d.Defect.Files,
            d.Defect.Note,
            d.Found,
            finding = d.FindingNumber,
            findingKind = d.Finding is { } f ? FindingKindText.Code(f.Kind) : null,
            findingKey = d.Finding?.Key,
        }),
        defectsFound = result.DefectsFound,
        defectsPlanted = result.Defects.Count,
        caution = MatchCaution.Text,
        next = NextSteps.Select(s => s.Command),
    };

    /// <summary>A heading used mid-sentence: first letter lower case, SKU kept as written.</summary>
    private static string Lower(string label) => char.ToLowerInvariant(label[0]) + label[1..];

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

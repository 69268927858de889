using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Lookup.Calibration;
using Lookup.Store;

namespace Lookup.Cli;

/// <summary><c>lookup status --index FILE</c>: what an index holds and whether its thresholds still fit it.</summary>
internal static class StatusCommand
{
    private static readonly JsonSerializerOptions Json = new() { PropertyNamingPolicy = JsonNamingPolicy.CamelCase, WriteIndented = true };

    public static Command Create()
    {
        var index = IndexOption.Create();
        var json = new Option<bool>("--json") { Description = "Print the status as JSON on stdout." };
        var command = new Command(
            "status",
            """
            Show what an index holds: photos indexed and failed, SKUs, graph nodes, the model, the catalogue folder and
            SKU mapping, the verdict thresholds and where they come from, and the last sweep. Warns when the index was
            never calibrated, has grown or shrunk by more than 20 % since, or holds another model than the thresholds.
            Opens the index read-only, so it can run beside ingest.

            Example:
              lookup status --index parts.lookup
              lookup status --index parts.lookup --json

            Exit codes: 0 status shown (warnings included), 1 index missing or unreadable, 2 usage error.
            """)
        {
            index, json,
        };
        command.SetAction(parseResult => Run(
            parseResult.GetValue(index)!,
            parseResult.GetValue(json),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error));
        return command;
    }

    private static int Run(string indexPath, bool json, TextWriter output, TextWriter error)
    {
        IndexStatus status;
        try
        {
            using var file = IndexFile.Open(indexPath, IndexAccess.Read);
            status = IndexStatus.Read(file);
        }
        catch (IndexFileException e)
        {
            error.WriteLine($"lookup status: {e.Message}");
            return ExitCodes.Failures;
        }

        if (json)
        {
            output.WriteLine(JsonSerializer.Serialize(ToJson(status), Json));
        }
        else
        {
            WriteText(status, output);
        }

        return ExitCodes.Success;
    }

    private static void WriteText(IndexStatus s, TextWriter output)
    {
        void Line(string key, string value) => output.WriteLine($"{key,-12}  {value}");

        Line("index", F($"{s.IndexPath} (schema {s.SchemaVersion})"));
        Line("photos", F($"{s.PhotosIndexed:N0} indexed, {s.PhotosFailed:N0} failed, {s.PhotosWithoutSku:N0} indexed without a SKU"));
        Line("SKUs", F($"{s.Skus:N0}"));
        Line("graph", F($"{s.GraphNodes:N0} nodes: {s.GraphLive:N0} live, {s.GraphDeleted:N0} retired ({s.Dimension} floats each)"));
        Line("model", s.ModelName is null ? "none yet" : $"{s.ModelName} (fingerprint {IndexModelCard.Short(s.ModelFingerprint)})");
        Line("catalogue", s.CatalogueRoot is null
            ? "none yet"
            : F($"{s.CatalogueRoot} ({(s.CatalogueRootFound ? "found" : "NOT FOUND")}), SKUs from {s.SkuMapping}, last ingest {s.LastIngestUtc:yyyy-MM-dd HH:mm} UTC"));
        Line("thresholds", Thresholds(s.Thresholds));
        if (s.Calibration is { } c)
        {
            Line("measured", F($"held-out strangers inside the copy band {Pct(c.StrangersInCopyBand)} (target {c.TargetFalseMatchRate:0.00 %}), inside same part {Pct(c.StrangersInSamePartBand)}; copies caught {Pct(c.CopiesInCopyBand)}"));
        }

        Line("last sweep", s.LastSweepUtc is DateTime at ? F($"{at:yyyy-MM-dd HH:mm} UTC ({s.Sweeps:N0} stored)") : s.Sweeps > 0 ? F($"{s.Sweeps:N0} stored, time unknown") : "none");
        foreach (var warning in s.Warnings)
        {
            Line("warning", warning);
        }
    }

    private static string Thresholds(VerdictThresholds t)
    {
        string limits = F($"copy ≤ {t.Copy:0.000}, same part ≤ {t.SamePart:0.000}, margin {t.MinMargin:0.00}");
        return t.CalibratedUtc is DateTime at
            ? F($"{limits} ({t.Source} {at:yyyy-MM-dd HH:mm} UTC on {t.SampleSize:N0} sampled of {t.PhotosAtCalibration:N0} photos, target {t.TargetFalseMatchRate:0.00 %})")
            : $"{limits} ({t.Source})";
    }

    private static string Pct(RateCount rate) => rate.Total == 0 ? "-" : F($"{rate.Rate:0.00 %} ({rate.Inside:N0}/{rate.Total:N0})");

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);

    private static object ToJson(IndexStatus s) => new
    {
        index = s.IndexPath,
        s.SchemaVersion,
        photos = new { indexed = s.PhotosIndexed, failed = s.PhotosFailed, withoutSku = s.PhotosWithoutSku },
        s.Skus,
        graph = new { nodes = s.GraphNodes, live = s.GraphLive, retired = s.GraphDeleted, dimension = s.Dimension },
        model = new { name = s.ModelName, fingerprint = s.ModelFingerprint },
        catalogue = new { root = s.CatalogueRoot, found = s.CatalogueRootFound, skuMapping = s.SkuMapping, lastIngestUtc = s.LastIngestUtc },
        thresholds = s.Thresholds,
        calibration = s.Calibration is not { } c ? null : new
        {
            calibratedUtc = c.CalibratedUtc,
            c.Seed,
            c.PhotosSampled,
            c.Copies,
            c.TargetFalseMatchRate,
            c.SamePartFalseMatchRate,
            heldOut = new
            {
                strangersInCopyBand = Rate(c.StrangersInCopyBand),
                strangersInSamePartBand = Rate(c.StrangersInSamePartBand),
                copiesInCopyBand = Rate(c.CopiesInCopyBand),
                siblingsInSamePartBand = Rate(c.SiblingsInSamePartBand),
            },
        },
        sweeps = new { stored = s.Sweeps, lastUtc = s.LastSweepUtc },
        warnings = s.Warnings,
    };

    private static object Rate(RateCount rate) => new { inside = rate.Inside, total = rate.Total, rate = rate.Rate };
}

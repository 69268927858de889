using System.Globalization;
using Lookup.Calibration;
using Lookup.Reports;

namespace Lookup.Sweeps;

/// <summary>
/// The report as one self-contained HTML page: no network and no other files (previews are data: URIs, style and
/// script inline, and a content security policy forbids any fetch). Findings are grouped and can be filtered by kind;
/// each shows its photos side by side with SKU, path and role, its pairs with distance and evidence, and its verdict.
/// Every name, SKU and path is escaped (<see cref="HtmlText"/>).
/// </summary>
public static class SweepHtmlWriter
{
    /// <summary>Writes the page.</summary>
    /// <param name="report">The report.</param>
    /// <param name="writer">Where the page goes (write it as UTF-8).</param>
    /// <param name="previews">JPEG previews of photos; without it each photo shows a "no preview" box.</param>
    /// <param name="maxFindings">Findings shown; the rest are counted (the CSV and JSON hold all).</param>
    /// <param name="maxPairsPerFinding">Pairs listed per finding; the rest are counted.</param>
    /// <param name="caption">A line under the title (e.g. which index and catalogue root); escaped.</param>
    /// <param name="newKeys">Keys of findings to mark as new since the previous sweep; null marks none.</param>
    /// <param name="calibration">The index's calibration: its plot is embedded (a data: PNG) with its bands, date
    /// and sample size. Null: the page says the bands are defaults and how to calibrate.</param>
    public static void Write(
        SweepReport report,
        TextWriter writer,
        ReportThumbnailSource? previews = null,
        int maxFindings = 2000,
        int maxPairsPerFinding = 50,
        string? caption = null,
        IReadOnlySet<string>? newKeys = null,
        CalibrationRecord? calibration = null)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentOutOfRangeException.ThrowIfNegative(maxFindings);
        ArgumentOutOfRangeException.ThrowIfNegative(maxPairsPerFinding);
        var images = new Dictionary<int, string?>();
        writer.Write("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">");
        writer.Write($"<meta http-equiv=\"Content-Security-Policy\" content=\"{SweepHtmlPage.ContentSecurityPolicy}\">");
        writer.Write($"<title>Catalogue sweep {Time(report.StartedAt)}</title><style>{SweepHtmlPage.Style}</style></head><body>\n");
        writer.Write($"<h1>Catalogue sweep, {Time(report.StartedAt)}</h1>\n");
        if (caption is not null)
        {
            writer.Write($"<p class=\"caption\">{E(caption)}</p>\n");
        }

        writer.Write($"<p class=\"notice\">{E(report.Notice)}</p>\n");
        WriteSummary(report, writer);
        WriteBands(report, writer, calibration);
        for (var f = 0; f < Math.Min(report.Findings.Count, maxFindings); f++)
        {
            WriteFinding(report.Findings[f], f + 1, writer, previews, images, maxPairsPerFinding, newKeys);
        }

        if (report.Findings.Count > maxFindings)
        {
            writer.Write($"<p class=\"muted\">{report.Findings.Count - maxFindings} more findings are in the CSV and JSON reports.</p>\n");
        }

        writer.Write($"<p class=\"notice\">{E(report.Notice)}</p>\n");
        writer.Write($"<script>{SweepHtmlPage.Script}</script>\n</body></html>\n");
    }

    private static string E(string? text) => HtmlText.Escape(text);

    private static string Time(DateTimeOffset t) => t.UtcDateTime.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture);

    private static string N(double value, string format) => value.ToString(format, CultureInfo.InvariantCulture);

    private static void WriteSummary(SweepReport report, TextWriter writer)
    {
        var c = report.Counts;
        writer.Write("<table class=\"summary\">");
        writer.Write($"<tr><th>Photos</th><td>{c.Photos}</td><th>SKUs</th><td>{c.Skus}</td><th>Pairs examined</th><td>{c.PairsExamined}</td></tr>");
        writer.Write($"<tr><th>Identical files</th><td>{c.IdenticalPairs}</td><th>Same pixels</th><td>{c.SamePixelPairs}</td><th>Copies</th><td>{c.CopyPairs}</td></tr>");
        writer.Write($"<tr><th>Look-alike pairs</th><td>{c.LookAlikePairs}</td><th>Views inside one SKU (not reported)</th><td>{c.OtherViewPairs}</td>");
        writer.Write($"<th>Dismissed / already reported</th><td>{c.SuppressedByDecisions} / {c.AlreadyReported}</td></tr></table>\n");
        writer.Write("<p class=\"filters\">Show: ");
        foreach (var (kind, count) in report.FindingsByKind)
        {
            writer.Write($"<label><input type=\"checkbox\" checked data-kind=\"{FindingKindText.Code(kind)}\"> {E(FindingKindText.Label(kind))} ({count})</label>");
        }

        writer.Write("</p>\n");
    }

    /// <summary>
    /// Where the distance bands come from: the calibration plot with a caption, or a note that they are defaults.
    /// </summary>
    private static void WriteBands(SweepReport report, TextWriter writer, CalibrationRecord? calibration)
    {
        var settings = report.Settings;
        writer.Write("<details class=\"bands\" open><summary>Verdict bands</summary>");
        if (calibration is null)
        {
            writer.Write($"<p class=\"uncalibrated\">This index has not been calibrated: the sweep used its default bands " +
                $"(copy evidence looked for up to distance {N(settings.CopyMaxDistance, "0.00")}, look-alikes up to " +
                $"{N(settings.LookAlikeMaxDistance, "0.00")}), measured on reference photos, not on this catalogue. Run " +
                "<code>lookup calibrate --index FILE</code> to measure them on this catalogue; the next report then shows " +
                "the distance histograms here.</p>");
        }
        else
        {
            var png = CalibrationPlot.RenderPng(calibration);
            var at = calibration.CalibratedUtc.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture);
            var strangers = calibration.StrangersInCopyBand;
            writer.Write($"<figure class=\"calibration\"><img alt=\"Distance histograms of copies, siblings and strangers " +
                $"with the verdict bands marked\" width=\"{CalibrationPlot.DefaultWidth}\" height=\"{CalibrationPlot.DefaultHeight}\" " +
                $"src=\"data:image/png;base64,{Convert.ToBase64String(png)}\">");
            writer.Write($"<figcaption>Calibrated {E(at)} on {calibration.PhotosSampled} photos ({calibration.Copies} planted " +
                $"copies; seed {calibration.Seed}): copy ≤ {N(calibration.Copy, "0.000")}, same part ≤ " +
                $"{N(calibration.SamePart, "0.000")}; strangers inside the copy band {strangers.Inside} of {strangers.Total} " +
                $"(target {N(calibration.TargetFalseMatchRate * 100, "0.###")} %). Green: copies, blue: other photos of " +
                "the same SKU, red: photos of different SKUs; shaded: the copy band (green) and the same-part band (sand).</figcaption></figure>");
        }

        writer.Write("</details>\n");
    }

    private static void WriteFinding(
        SweepFinding finding,
        int number,
        TextWriter writer,
        ReportThumbnailSource? previews,
        Dictionary<int, string?> images,
        int maxPairs,
        IReadOnlySet<string>? newKeys)
    {
        var badge = newKeys?.Contains(finding.Key) == true ? " <span class=\"new\">new</span>" : "";
        writer.Write($"<section class=\"finding\" data-kind=\"{FindingKindText.Code(finding.Kind)}\" id=\"f{number}\">");
        writer.Write($"<h2>{number}. {E(FindingKindText.Label(finding.Kind))}{badge}</h2><p>{E(finding.Verdict)}</p><div class=\"photos\">");
        foreach (var member in finding.Members)
        {
            WriteFigure(member, writer, previews, images);
        }

        writer.Write("</div>");
        if (finding.Outlier is { } o)
        {
            writer.Write($"<p>Distance to its own SKU {N(o.DistanceToOwnSku, "0.000")}");
            writer.Write(o.OwnSkuSpread is { } spread ? $" (typical in the SKU {N(spread, "0.000")})" : "");
            writer.Write($"; to SKU {E(o.NearestOtherSku)} {N(o.DistanceToOtherSku, "0.000")}.</p>");
        }

        WritePairs(finding, writer, maxPairs);
        writer.Write($"<p class=\"muted\">Key {E(finding.Key)}</p></section>\n");
    }

    private static void WriteFigure(FindingMember member, TextWriter writer, ReportThumbnailSource? previews, Dictionary<int, string?> images)
    {
        if (!images.TryGetValue(member.PhotoId, out var uri))
        {
            var jpeg = previews?.Invoke(member);
            uri = jpeg is { Length: > 0 } ? "data:image/jpeg;base64," + Convert.ToBase64String(jpeg) : null;
            images[member.PhotoId] = uri;
        }

        writer.Write("<figure>");
        writer.Write(uri is null
            ? "<div class=\"nopreview\">no preview</div>"
            : $"<img src=\"{uri}\" alt=\"{E(member.Path)}\">");
        writer.Write($"<figcaption><b>SKU {E(member.Sku)}</b><br>{E(member.Path)}<br>");
        writer.Write($"{member.Width} × {member.Height}, {N(member.FileSize / 1024.0, "0.#")} KB");
        if (member.Role != MemberRole.Member)
        {
            writer.Write($"<br><span class=\"role\">{E(FindingKindText.Role(member.Role))}</span>");
        }

        writer.Write("</figcaption></figure>");
    }

    private static void WritePairs(SweepFinding finding, TextWriter writer, int maxPairs)
    {
        if (finding.Pairs.Count == 0)
        {
            return;
        }

        var pathOf = finding.Members.GroupBy(m => m.PhotoId).ToDictionary(g => g.Key, g => g.First().Path);
        writer.Write("<table class=\"pairs\"><tr><th>Photo</th><th>Photo</th><th>Verdict</th><th>Distance</th><th>dHash bits</th><th>Thumbnail match</th></tr>");
        foreach (var pair in finding.Pairs.Take(maxPairs))
        {
            var e = pair.Evidence;
            writer.Write($"<tr><td>{E(pathOf.GetValueOrDefault(pair.FirstPhotoId))}</td><td>{E(pathOf.GetValueOrDefault(pair.SecondPhotoId))}</td>");
            writer.Write($"<td>{E(FindingKindText.Relation(pair.Relation, e.Edits))}</td><td>{N(e.Distance, "0.0000")}</td>");
            writer.Write($"<td>{e.HashDistance}</td><td>{(e.Correlation is { } c ? N(c, "0.000") : "–")}</td></tr>");
        }

        writer.Write("</table>");
        if (finding.Pairs.Count > maxPairs)
        {
            writer.Write($"<p class=\"muted\">and {finding.Pairs.Count - maxPairs} more pairs</p>");
        }
    }
}

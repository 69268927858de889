using System.Globalization;
using Lookup.Cli.Output;
using Lookup.Sweeps;

namespace Lookup.Cli;

/// <summary>The sweep as text on stdout: one aligned table per kind, most severe first, a row per photo.</summary>
internal static partial class SweepCommand
{
    /// <summary>Key digits shown in the table (48 bits: unique in practice); `lookup dismiss` takes this prefix.</summary>
    private const int ShownKeyDigits = 12;

    private static void WriteText(Request request, IndexSweepResult result, TextWriter output)
    {
        var report = result.Report;
        var c = report.Counts;
        var seconds = (report.FinishedAt - report.StartedAt).TotalSeconds;
        output.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"{(result.Number is int n ? $"Sweep {n}" : "Sweep")} of {request.Index}, {report.StartedAt.UtcDateTime:yyyy-MM-dd HH:mm} UTC: " +
            $"{c.Photos} photos in {c.Skus} SKUs, {c.PairsExamined} pairs examined in {seconds:0.0} s."));
        if (result.CatalogueRoot is not null)
        {
            output.WriteLine($"Paths are relative to the catalogue root {result.CatalogueRoot}.");
        }

        foreach (var group in report.Findings.Select((f, i) => (Finding: f, Number: i + 1)).GroupBy(x => x.Finding.Kind))
        {
            var fresh = group.Count(x => result.NewKeys.Contains(x.Finding.Key));
            output.WriteLine();
            output.WriteLine($"{FindingKindText.Label(group.Key)}: {Plural(group.Count(), "finding")}, {fresh} new");
            output.WriteLine(Advice(group.Key));
            var table = new TextTable("#", "new", "SKU", "photo", "distance", "verdict", "key").AlignRight(0, 4);
            foreach (var (finding, number) in group)
            {
                AddRows(table, finding, number, result.NewKeys.Contains(finding.Key));
            }

            // Continuation rows leave the last column empty: no trailing blanks.
            output.Write(string.Join('\n', table.ToString().Split('\n').Select(line => line.TrimEnd())));
        }

        output.WriteLine();
        WriteFooter(request, result, output);
        output.WriteLine(Verdicts.SafetyNotice);
    }

    private static void AddRows(TextTable table, SweepFinding finding, int number, bool isNew)
    {
        var first = true;
        foreach (var member in finding.Members)
        {
            var (distance, verdict) = Tie(finding, member);
            table.Add(
                first ? number.ToString(CultureInfo.InvariantCulture) : "",
                first && isNew ? "new" : "",
                member.Sku,
                member.Path,
                distance is float d ? Math.Max(0f, d).ToString("0.0000", CultureInfo.InvariantCulture) : "",
                verdict,
                first ? finding.Key[..ShownKeyDigits] : "");
            first = false;
        }
    }

    /// <summary>A member's closest tie inside its finding: distance and what the sweep concluded.</summary>
    private static (float? Distance, string Verdict) Tie(SweepFinding finding, FindingMember member)
    {
        if (finding.Outlier is { } o)
        {
            return member.Role switch
            {
                MemberRole.Flagged => (o.DistanceToOwnSku, o.OwnSkuSpread is float spread
                    ? string.Create(CultureInfo.InvariantCulture, $"far from its SKU (typical {spread:0.000})")
                    : "far from its SKU"),
                MemberRole.NearestInOwnSku => (o.DistanceToOwnSku, FindingKindText.Role(member.Role)),
                MemberRole.NearestInOtherSku => (o.DistanceToOtherSku, FindingKindText.Role(member.Role)),
                _ => (null, FindingKindText.Role(member.Role)),
            };
        }

        var closest = finding.Pairs
            .Where(p => p.FirstPhotoId == member.PhotoId || p.SecondPhotoId == member.PhotoId)
            .MinBy(p => p.Evidence.Distance);
        return closest is null
            ? (null, "")
            : (closest.Evidence.Distance, FindingKindText.Relation(closest.Relation, closest.Evidence.Edits));
    }

    private static string Advice(FindingKind kind) => kind switch
    {
        FindingKind.SamePhotoSeveralSkus => "A photo shows one part: keep it under the SKU it shows and replace it under the others.",
        FindingKind.CopiesInOneSku => "Keep the best copy of each group and remove the others.",
        FindingKind.LookAlikesAcrossSkus => "The same part filed twice, or similar parts: compare part numbers, dimensions and ratings before merging.",
        _ => "Possibly filed under the wrong SKU: check the part in the photo against both SKUs before moving it.",
    };

    private static void WriteFooter(Request request, IndexSweepResult result, TextWriter output)
    {
        var c = result.Report.Counts;
        var fresh = result.Report.Findings.Count(f => result.NewKeys.Contains(f.Key));
        output.WriteLine(result.Report.Findings.Count == 0
            ? request.NewOnly ? "No new findings." : "No findings."
            : $"{Plural(result.Report.Findings.Count, "finding")}, {fresh} new since {(result.Previous is null ? "the start (no earlier sweep is stored)" : $"sweep {result.Previous.Number}")}.");
        if (c.SuppressedByDecisions > 0)
        {
            output.WriteLine($"{Plural(c.SuppressedByDecisions, "finding")} not shown: dismissed by reviewers.");
        }

        if (c.AlreadyReported > 0)
        {
            output.WriteLine($"{Plural(c.AlreadyReported, "finding")} not shown: already reported by sweep {result.Previous?.Number} (--new-only).");
        }

        if (c.PairsWithoutThumbnails > 0)
        {
            output.WriteLine($"{Plural((int)c.PairsWithoutThumbnails, "pair")} judged by the dHash alone (no stored thumbnail): ingest again to add thumbnails.");
        }

        if (result.PhotosWithoutSku + result.PhotosWithoutNode > 0)
        {
            output.WriteLine($"Left out: {result.PhotosWithoutSku} photos without a SKU, {result.PhotosWithoutNode} records without a live graph node (run ingest again).");
        }

        output.WriteLine(result.Stored
            ? $"Stored as sweep {result.Number}; dismiss a finding with: lookup dismiss --index {request.Index} KEY"
            : request.NoStore ? "Not stored (--no-store)." : $"Not stored: {result.NotStoredReason}");
    }

    private static string Plural(int count, string noun) => count == 1 ? $"1 {noun}" : $"{count} {noun}s";
}

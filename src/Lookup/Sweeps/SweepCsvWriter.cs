using Lookup.Reports;

namespace Lookup.Sweeps;

/// <summary>
/// The report as one CSV table, one row per photo per finding, for spreadsheets: each row names the finding, the photo
/// and its closest tie inside the finding. Text cells are neutralised against formula injection and quoted
/// (<see cref="CsvCell"/>).
/// </summary>
public static class SweepCsvWriter
{
    private static readonly string[] Header =
    [
        "finding", "kind", "finding_key", "role", "sku", "path", "sha256", "width", "height", "bytes",
        "closest_path", "relation", "distance", "dhash_bits", "correlation", "verdict",
    ];

    /// <summary>Writes the table, header first, CRLF line ends (RFC 4180).</summary>
    public static void Write(SweepReport report, TextWriter writer)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(writer);
        var table = new CsvTableWriter(writer);
        table.Row(Header);
        for (var f = 0; f < report.Findings.Count; f++)
        {
            var finding = report.Findings[f];
            var pathOf = finding.Members.GroupBy(m => m.PhotoId).ToDictionary(g => g.Key, g => g.First().Path);
            foreach (var member in finding.Members)
            {
                table.Number(f + 1).Text(FindingKindText.Code(finding.Kind)).Text(finding.Key)
                    .Text(FindingKindText.Role(member.Role)).Text(member.Sku).Text(member.Path).Text(member.Sha256)
                    .Number(member.Width).Number(member.Height).Number(member.FileSize);
                WriteTie(table, finding, member, pathOf);
                table.Text(finding.Verdict).EndRow();
            }
        }
    }

    private static void WriteTie(CsvTableWriter table, SweepFinding finding, FindingMember member, Dictionary<int, string> pathOf)
    {
        if (finding.Outlier is { } outlier && member.Role == MemberRole.Flagged)
        {
            table.Text("").Text("far from its SKU").Number(outlier.DistanceToOwnSku, "0.0000").Text("").Text("");
            return;
        }

        var closest = finding.Pairs
            .Where(p => p.FirstPhotoId == member.PhotoId || p.SecondPhotoId == member.PhotoId)
            .MinBy(p => p.Evidence.Distance);
        if (closest is null)
        {
            table.Text("").Text("").Text("").Text("").Text("");
            return;
        }

        var other = closest.FirstPhotoId == member.PhotoId ? closest.SecondPhotoId : closest.FirstPhotoId;
        table.Text(pathOf.GetValueOrDefault(other, ""))
            .Text(FindingKindText.Relation(closest.Relation, closest.Evidence.Edits))
            .Number(closest.Evidence.Distance, "0.0000")
            .Number(closest.Evidence.HashDistance)
            .Number(closest.Evidence.Correlation ?? double.NaN, "0.000");
    }
}

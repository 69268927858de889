using Lookup.Matching;
using Lookup.Reports;

namespace Lookup.Cli;

/// <summary>One CSV row per SKU per answer (RFC 4180; cells that could start a formula are neutralised).</summary>
internal static class MatchCsvWriter
{
    public static void Write(MatchReport report, TextWriter output)
    {
        var csv = new CsvTableWriter(output);
        csv.Row("query", "rank", "sku", "distance", "verdict", "photos_matched", "photos_in_sku", "best_photo");
        foreach (var answer in report.Run.Answers)
        {
            string query = string.Join(" + ", answer.Photos);
            foreach (var row in answer.Ranking)
            {
                csv.Text(query).Number(row.Rank).Text(row.Sku).Number(Math.Round(row.Distance, 5)).Text(VerdictNames.Of(row.Verdict))
                    .Number(row.PhotosMatched).Number(row.PhotosInSku).Text(row.BestPhoto).EndRow();
            }
        }
    }
}

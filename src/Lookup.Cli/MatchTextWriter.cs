using System.Globalization;
using Lookup.Cli.Output;
using Lookup.Matching;

namespace Lookup.Cli;

/// <summary>The human answer: per query a heading, an aligned table, one sentence saying what it means, and the caution.</summary>
internal static class MatchTextWriter
{
    public static void Write(MatchReport report, TextWriter output)
    {
        int crops = QueryCrops.Count(report.Options.Crops);
        foreach (var answer in report.Run.Answers)
        {
            output.WriteLine(Heading(answer, report, crops));
            var table = new TextTable("rank", "SKU", "distance", "verdict", "matched", "best catalogue photo").AlignRight(0, 2, 4);
            foreach (var row in answer.Ranking)
            {
                table.Add(row.Rank, row.Sku, row.Distance, VerdictNames.Of(row.Verdict), $"{row.PhotosMatched}/{row.PhotosInSku}", row.BestPhoto);
            }

            output.Write(table.ToString());
            output.WriteLine(Sentence(answer, report));
            output.WriteLine(MatchCaution.Text);
            output.WriteLine();
        }

        var t = report.Thresholds;
        output.WriteLine(Invariant(
            $"Verdicts: same photo ≤ {t.Copy:0.00} for the whole photo, same part ≤ {t.SamePart:0.00} and {t.MinMargin:P0} nearer than the next SKU ({(t.Source == "default" ? "defaults; lookup calibrate measures them on your catalogue" : t.Source)}). 'matched' counts a SKU's photos within {t.SamePart:0.00}."));
    }

    private static string Heading(MatchAnswer answer, MatchReport report, int crops)
    {
        if (report.Options.Like is not null)
        {
            return $"Like {answer.Photos[0]} (stored vectors, its own photos left out)";
        }

        string regions = crops == 1 ? "whole photo" : $"whole photo + {crops - 1} crops";
        return answer.Photos.Count == 1
            ? $"{answer.Photos[0]} ({regions})"
            : $"{string.Join(" + ", answer.Photos)} ({answer.Photos.Count} photos fused: {report.Fusion}; {regions} each)";
    }

    internal static string Sentence(MatchAnswer answer, MatchReport report)
    {
        if (answer.Ranking.Count == 0)
        {
            return "Answer: no match: the index returned no photos.";
        }

        var first = answer.Ranking[0];
        var next = answer.Ranking.Count > 1 ? answer.Ranking[1] : null;
        return answer.Verdict switch
        {
            Verdict.SameFile => $"Answer: {first.Sku}: the same file is in the catalogue as {first.BestPhoto}." +
                (answer.Ranking.Skip(1).Where(r => r.Verdict == Verdict.SameFile).Select(r => r.Sku).ToList() is { Count: > 0 } also
                    ? $" It is also filed under {string.Join(", ", also)}: the catalogue holds one file under several SKUs."
                    : ""),
            Verdict.SamePhoto => $"Answer: {first.Sku}: the same photo as {first.BestPhoto}, edited or re-saved.",
            Verdict.SamePart => Invariant($"Answer: {first.Sku}: probably the same part") +
                (next is null ? "." : Invariant($" ({first.Margin:P0} nearer than {next.Sku}).")),
            Verdict.Unsure => $"Answer: unsure: {List(answer.Ranking.Where(r => r.Verdict == Verdict.Unsure).Select(r => r.Sku).ToList())} are about equally close; compare them with the part (size, thread, finish).",
            _ => Invariant($"Answer: no match: nothing in the catalogue is within {report.Thresholds.SamePart:0.00} (nearest: {first.Sku} at {first.Distance:0.0000})."),
        };
    }

    private static string List(IReadOnlyList<string> skus) =>
        skus.Count == 1 ? skus[0] : string.Join(", ", skus.Take(skus.Count - 1)) + " and " + skus[^1];

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

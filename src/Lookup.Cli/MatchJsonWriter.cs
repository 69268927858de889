using System.Text.Json;
using Lookup.Matching;

namespace Lookup.Cli;

/// <summary>The answer for scripts: one JSON object (camelCase) with settings, answers, failures and the caution.</summary>
internal static class MatchJsonWriter
{
    private static readonly JsonSerializerOptions Json = new() { PropertyNamingPolicy = JsonNamingPolicy.CamelCase, WriteIndented = true };

    public static void Write(MatchReport report, TextWriter output)
    {
        var t = report.Thresholds;
        output.WriteLine(JsonSerializer.Serialize(
            new
            {
                index = report.Index,
                crops = report.Options.Like is null ? report.Options.Crops.ToString().ToLowerInvariant() : null,
                regionsPerPhoto = report.Options.Like is null ? QueryCrops.Count(report.Options.Crops) : 1,
                fusion = report.Fusion,
                thresholds = new { copy = t.Copy, samePart = t.SamePart, minMargin = t.MinMargin, source = t.Source },
                answers = report.Run.Answers.Select(a => new
                {
                    photos = a.Photos,
                    verdict = VerdictNames.Of(a.Verdict),
                    sku = MatchReport.AnswerSku(a),
                    ranking = a.Ranking.Select(r => new
                    {
                        rank = r.Rank,
                        sku = r.Sku,
                        distance = Round(r.Distance),
                        wholePhotoDistance = Round(r.WholePhotoDistance),
                        margin = Round(r.Margin),
                        verdict = VerdictNames.Of(r.Verdict),
                        photosMatched = r.PhotosMatched,
                        photosInSku = r.PhotosInSku,
                        bestPhoto = r.BestPhoto,
                    }),
                }),
                failures = report.Run.Failures,
                caution = MatchCaution.Text,
            },
            Json));
    }

    private static double Round(float value) => Math.Round(value, 5);
}

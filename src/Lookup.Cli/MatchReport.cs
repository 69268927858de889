using Lookup.Matching;
using Lookup.Store;

namespace Lookup.Cli;

/// <summary>What the match writers render: the run plus the settings that produced it.</summary>
internal sealed record MatchReport(string Index, MatchOptions Options, VerdictThresholds Thresholds, MatchRun Run)
{
    /// <summary>How several photos became one ranking, or null when each photo was ranked alone.</summary>
    public string? Fusion => Options.Each || Run.Answers.All(a => a.Photos.Count < 2 && Options.Like is null)
        ? null
        : "each SKU scored by its nearest photo over all query photos";

    /// <summary>The SKU an answer names: the first row's, when its verdict says it is that part; otherwise null.</summary>
    public static string? AnswerSku(MatchAnswer answer) =>
        answer.Verdict is Verdict.SameFile or Verdict.SamePhoto or Verdict.SamePart ? answer.Ranking[0].Sku : null;
}

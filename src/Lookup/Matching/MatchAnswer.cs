namespace Lookup.Matching;

/// <summary>The answer to one query (one photo, or several photos of one part fused).</summary>
/// <param name="Photos">The query photos' labels.</param>
/// <param name="Ranking">The nearest SKUs, nearest first.</param>
public sealed record MatchAnswer(IReadOnlyList<string> Photos, IReadOnlyList<SkuMatch> Ranking)
{
    /// <summary>The answer's verdict: the first row's, or no match for an empty ranking.</summary>
    public Verdict Verdict => Ranking.Count > 0 ? Ranking[0].Verdict : Verdict.NoMatch;
}

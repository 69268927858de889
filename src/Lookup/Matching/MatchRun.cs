namespace Lookup.Matching;

/// <summary>Everything one <c>match</c> call produced: answers for the photos that could be used, failures for the rest.</summary>
internal sealed record MatchRun(IReadOnlyList<MatchAnswer> Answers, IReadOnlyList<QueryFailure> Failures);

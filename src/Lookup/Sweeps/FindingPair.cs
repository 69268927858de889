namespace Lookup.Sweeps;

/// <summary>Two photos of a finding, what they are to each other and the evidence.</summary>
/// <param name="FirstPhotoId">One photo's id.</param>
/// <param name="SecondPhotoId">The other photo's id.</param>
/// <param name="Relation">What the sweep concluded.</param>
/// <param name="Evidence">What it measured.</param>
/// <param name="Key">The pair's key (<see cref="FindingKeys.Pair"/>): a reviewer's "not a duplicate" is stored under it.</param>
public sealed record FindingPair(int FirstPhotoId, int SecondPhotoId, PairRelation Relation, PairEvidence Evidence, string Key);

using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>A photo record read from a part, with its embedding when the merge may need it, competing for its path.</summary>
/// <param name="Record">The record as the part holds it (its node id is the part's, not the target's).</param>
/// <param name="Vector">The embedding; null for failed photos and for content the target already holds embedded.</param>
internal sealed record MergeCandidate(PhotoRecord Record, float[]? Vector);

using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>The decision for one path: the winning record from the parts and what the target held before.</summary>
internal sealed record MergeStep(MergeStepKind Kind, MergeCandidate Winner, PhotoRecord? Known);

using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>A worker's result: the record to store and, for a success, the embedding to add to the graph.</summary>
internal sealed record PhotoOutcome(PhotoJob Job, PhotoRecord Record, float[]? Embedding);

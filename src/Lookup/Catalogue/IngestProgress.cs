namespace Lookup.Catalogue;

/// <summary>Where an ingest run is: photos embedded (or failed) so far out of those to embed.</summary>
internal readonly record struct IngestProgress(string Stage, int Done, int Total, int Failed);

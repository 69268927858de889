namespace Lookup.Cli;

/// <summary>The parsed options of <c>lookup ingest</c>.</summary>
internal sealed record IngestRequest(
    string Tree,
    string Index,
    string SkuFrom,
    int Workers,
    bool KeepMissing,
    bool RetryFailed,
    double MaxMegapixels,
    double MaxDecodeSeconds,
    string? Shard,
    int BatchSize,
    bool Json,
    bool Quiet,
    string? Model);

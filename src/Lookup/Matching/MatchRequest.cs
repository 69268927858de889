namespace Lookup.Matching;

/// <summary>What a match run is asked for.</summary>
/// <param name="Top">Rows per ranking.</param>
/// <param name="Crops">Which regions of each query photo are embedded.</param>
/// <param name="Each">One ranking per photo instead of one fused ranking for all photos.</param>
/// <param name="Workers">Threads for embedding crops and searching (one shared network session).</param>
internal sealed record MatchRequest(int Top, CropSet Crops, bool Each, int Workers);

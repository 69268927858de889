namespace Lookup.Calibration;

/// <summary>Progress of a calibration run.</summary>
/// <param name="Stage">"copies" while copies are made and embedded (pairs of stored embeddings take a moment after).</param>
/// <param name="Done">Sampled photos finished.</param>
/// <param name="Total">Sampled photos in all.</param>
/// <param name="Skipped">Sampled photos that could not be used so far.</param>
public sealed record CalibrationProgress(string Stage, int Done, int Total, int Skipped);

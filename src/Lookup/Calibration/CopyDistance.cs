namespace Lookup.Calibration;

/// <summary>The distance between a copy's embedding and its original's stored embedding.</summary>
/// <param name="Photo">Index of the original among the calibration photos.</param>
/// <param name="Kind">The edit that made the copy.</param>
/// <param name="Distance">Cosine distance, 1 − dot product.</param>
internal readonly record struct CopyDistance(int Photo, CopyEditKind Kind, float Distance);

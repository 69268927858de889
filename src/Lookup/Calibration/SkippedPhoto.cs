namespace Lookup.Calibration;

/// <summary>A sampled photo that got no copies, and why.</summary>
/// <param name="Path">The photo's path relative to the catalogue root.</param>
/// <param name="Reason">What went wrong and what to do.</param>
public sealed record SkippedPhoto(string Path, string Reason);

namespace Lookup.Cli;

/// <summary>What <c>lookup inspect --json</c> prints for a photo that decoded and embedded.</summary>
internal sealed record InspectReport(
    string Photo,
    string Format,
    int StoredWidth,
    int StoredHeight,
    long FileBytes,
    int Frames,
    int Orientation,
    int Width,
    int Height,
    double DecodeMs,
    double ResizeMs,
    double InferenceMs,
    int Dimension,
    float Norm,
    string DifferenceHash,
    string Model,
    string Fingerprint);

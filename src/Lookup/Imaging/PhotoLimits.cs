namespace Lookup.Imaging;

/// <summary>
/// Limits a photo must meet before it is decoded. The file size and the pixel count from the header are checked
/// before any pixel is decoded, so a decompression bomb costs a header read, not gigabytes of memory.
/// </summary>
public sealed record PhotoLimits
{
    /// <summary>The limits used when none are given: 100 MP, 256 MiB, 1,000 frames, 30 s.</summary>
    public static PhotoLimits Default { get; } = new();

    /// <summary>Largest width × height accepted, read from the header before decoding.</summary>
    public long MaxPixels { get; init; } = 100_000_000;

    /// <summary>Largest file accepted, in bytes.</summary>
    public long MaxFileBytes { get; init; } = 256L * 1024 * 1024;

    /// <summary>Most frames (GIF, TIFF pages, WebP, APNG) a file may declare; only the first is ever decoded.</summary>
    public int MaxFrames { get; init; } = 1_000;

    /// <summary>Longest a decode may take before it is abandoned.</summary>
    public TimeSpan DecodeTimeout { get; init; } = TimeSpan.FromSeconds(30);

    internal void Validate()
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(MaxPixels);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(MaxFileBytes);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(MaxFileBytes, (long)Array.MaxLength);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(MaxFrames);
        ArgumentOutOfRangeException.ThrowIfLessThan(DecodeTimeout, TimeSpan.Zero);
    }
}

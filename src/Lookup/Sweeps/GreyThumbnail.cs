namespace Lookup.Sweeps;

/// <summary>
/// A 32 × 32 grey picture of a whole photo (squeezed to a square whatever its aspect ratio), 1 KB, small enough to
/// store at ingest. The sweep aligns two of them to tell an edited copy from a different photo of the same part.
/// Immutable.
/// </summary>
public sealed class GreyThumbnail
{
    /// <summary>Width and height in pixels.</summary>
    public const int Side = 32;

    /// <summary>Number of pixels (and bytes).</summary>
    public const int Length = Side * Side;

    private readonly byte[] _pixels;

    /// <summary>Wraps <see cref="Length"/> grey levels given row by row, top row first (copied).</summary>
    public GreyThumbnail(ReadOnlySpan<byte> pixels)
    {
        if (pixels.Length != Length)
        {
            throw new ArgumentException(
                $"A grey thumbnail has {Length} bytes ({Side} × {Side}), this one has {pixels.Length}: rebuild it " +
                $"with {nameof(GreyThumbnail)}.{nameof(FromGrey)}.", nameof(pixels));
        }

        _pixels = pixels.ToArray();
    }

    /// <summary>The grey levels, row by row.</summary>
    public ReadOnlySpan<byte> Pixels => _pixels;

    /// <summary>
    /// Shrinks a grey image to 32 × 32 by area averaging: every thumbnail pixel is the mean of the source area it
    /// covers, fractions of pixels weighted by their share, so every source pixel counts once and JPEG noise averages
    /// out. Images smaller than 32 pixels in a dimension are stretched (each thumbnail pixel takes the source pixel
    /// under it).
    /// </summary>
    /// <param name="grey">Grey levels row by row, <paramref name="width"/> × <paramref name="height"/> bytes.</param>
    /// <param name="width">Image width in pixels.</param>
    /// <param name="height">Image height in pixels.</param>
    public static GreyThumbnail FromGrey(ReadOnlySpan<byte> grey, int width, int height) =>
        new(AreaShrink.ToSquare(grey, width, height, Side));
}

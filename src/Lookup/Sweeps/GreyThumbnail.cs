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
    public static GreyThumbnail FromGrey(ReadOnlySpan<byte> grey, int width, int height)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(width);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(height);
        if (grey.Length != (long)width * height)
        {
            throw new ArgumentException(
                $"A {width} × {height} grey image has {(long)width * height} bytes, {grey.Length} were given.", nameof(grey));
        }

        var columns = AreaWeights.For(width, Side);
        var rows = AreaWeights.For(height, Side);

        // Horizontal pass into height × 32 floats, then vertical pass into 32 × 32.
        var narrow = new float[height * Side];
        for (var y = 0; y < height; y++)
        {
            columns.Apply(grey.Slice(y * width, width), narrow.AsSpan(y * Side, Side));
        }

        var pixels = new byte[Length];
        var columnBuffer = new float[height];
        Span<float> shrunk = stackalloc float[Side];
        for (var x = 0; x < Side; x++)
        {
            for (var y = 0; y < height; y++)
            {
                columnBuffer[y] = narrow[(y * Side) + x];
            }

            rows.Apply(columnBuffer, shrunk);
            for (var y = 0; y < Side; y++)
            {
                pixels[(y * Side) + x] = (byte)Math.Clamp(MathF.Round(shrunk[y]), 0f, 255f);
            }
        }

        return new GreyThumbnail(pixels);
    }
}

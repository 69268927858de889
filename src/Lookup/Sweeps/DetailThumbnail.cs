namespace Lookup.Sweeps;

/// <summary>
/// A 64 × 64 grey picture of a whole photo (squeezed to a square whatever its aspect ratio), 4 KB, stored at ingest
/// beside the 32 × 32 <see cref="GreyThumbnail"/>. The 32 × 32 thumbnail finds where one photo could sit in another;
/// this one then checks the fine structure there (<see cref="DetailComparer"/>): two renders or shots of look-alike
/// parts in one pose share an outline at 32 × 32 but not their edges at 64 × 64, while an edited copy keeps them.
/// Immutable.
/// </summary>
public sealed class DetailThumbnail
{
    /// <summary>Width and height in pixels.</summary>
    public const int Side = 64;

    /// <summary>Number of pixels (and bytes).</summary>
    public const int Length = Side * Side;

    private readonly byte[] _pixels;

    /// <summary>Wraps <see cref="Length"/> grey levels given row by row, top row first (copied).</summary>
    public DetailThumbnail(ReadOnlySpan<byte> pixels)
    {
        if (pixels.Length != Length)
        {
            throw new ArgumentException(
                $"A detail thumbnail has {Length} bytes ({Side} × {Side}), this one has {pixels.Length}: rebuild it " +
                $"with {nameof(DetailThumbnail)}.{nameof(FromGrey)}.", nameof(pixels));
        }

        _pixels = pixels.ToArray();
    }

    /// <summary>The grey levels, row by row.</summary>
    public ReadOnlySpan<byte> Pixels => _pixels;

    /// <summary>
    /// Shrinks a grey image to 64 × 64 by area averaging (see <see cref="GreyThumbnail.FromGrey"/>; the same rule).
    /// </summary>
    /// <param name="grey">Grey levels row by row, <paramref name="width"/> × <paramref name="height"/> bytes.</param>
    /// <param name="width">Image width in pixels.</param>
    /// <param name="height">Image height in pixels.</param>
    public static DetailThumbnail FromGrey(ReadOnlySpan<byte> grey, int width, int height) =>
        new(AreaShrink.ToSquare(grey, width, height, Side));
}

namespace Lookup.Sweeps;

/// <summary>
/// The colour of a whole photo at 32 × 32 (squeezed to a square like <see cref="GreyThumbnail"/>): the two ITU-R
/// BT.709 colour-difference planes Cb then Cr, each offset by 128, 2 KB. Grey evidence cannot tell a brass part from
/// the same part in stainless steel shot the same way; colour can. Immutable.
/// </summary>
public sealed class ChromaThumbnail
{
    /// <summary>Width and height of each plane in pixels.</summary>
    public const int Side = GreyThumbnail.Side;

    /// <summary>Bytes in one plane.</summary>
    public const int PlaneLength = Side * Side;

    /// <summary>Bytes in all: the Cb plane, then the Cr plane.</summary>
    public const int Length = 2 * PlaneLength;

    private readonly byte[] _planes;

    /// <summary>Wraps <see cref="Length"/> bytes: the Cb plane then the Cr plane, each row by row (copied).</summary>
    public ChromaThumbnail(ReadOnlySpan<byte> planes)
    {
        if (planes.Length != Length)
        {
            throw new ArgumentException(
                $"A chroma thumbnail has {Length} bytes (two {Side} × {Side} planes), this one has {planes.Length}: " +
                $"rebuild it with {nameof(ChromaThumbnail)}.{nameof(FromPlanes)}.", nameof(planes));
        }

        _planes = planes.ToArray();
    }

    /// <summary>The Cb plane (blue minus luma, + 128), row by row.</summary>
    public ReadOnlySpan<byte> Cb => _planes.AsSpan(0, PlaneLength);

    /// <summary>The Cr plane (red minus luma, + 128), row by row.</summary>
    public ReadOnlySpan<byte> Cr => _planes.AsSpan(PlaneLength, PlaneLength);

    /// <summary>Both planes, Cb first.</summary>
    public ReadOnlySpan<byte> Planes => _planes;

    /// <summary>Cb of one RGB colour (BT.709, offset 128, rounded).</summary>
    public static byte CbOf(float red, float green, float blue) =>
        (byte)Math.Clamp((-0.1146f * red) - (0.3854f * green) + (0.5f * blue) + 128.5f, 0f, 255f);

    /// <summary>Cr of one RGB colour (BT.709, offset 128, rounded).</summary>
    public static byte CrOf(float red, float green, float blue) =>
        (byte)Math.Clamp((0.5f * red) - (0.4542f * green) - (0.0458f * blue) + 128.5f, 0f, 255f);

    /// <summary>Shrinks full-size Cb and Cr planes (see <see cref="CbOf"/>, <see cref="CrOf"/>) to 32 × 32 each by
    /// area averaging.</summary>
    public static ChromaThumbnail FromPlanes(ReadOnlySpan<byte> cb, ReadOnlySpan<byte> cr, int width, int height)
    {
        var planes = new byte[Length];
        AreaShrink.ToSquare(cb, width, height, Side).CopyTo(planes, 0);
        AreaShrink.ToSquare(cr, width, height, Side).CopyTo(planes, PlaneLength);
        return new ChromaThumbnail(planes);
    }
}

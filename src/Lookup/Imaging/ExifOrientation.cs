using System.Buffers.Binary;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Metadata.Profiles.Exif;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Imaging;

/// <summary>
/// The EXIF/TIFF orientation tag (TIFF 6.0 tag 274; EXIF 2.3 section 4.6.4): where row 0 and column 0 of the
/// stored pixels belong on screen. Values outside 1–8 (seen in the wild as 0 and 9) are treated as 1.
/// </summary>
internal static class ExifOrientation
{
    public const int Upright = 1;

    private const ushort OrientationTag = 274;
    private const ushort TypeShort = 3;
    private const ushort TypeLong = 4;

    /// <summary>
    /// The orientation in a TIFF-structured block (a TIFF file or an EXIF block, see <see cref="ExifBlock"/>): tag 274
    /// of the first directory. Anything missing, cut short or out of range gives <see cref="Upright"/>.
    /// </summary>
    public static int Read(ReadOnlySpan<byte> tiff)
    {
        if (tiff.Length < 8)
        {
            return Upright;
        }

        bool little;
        if (tiff.StartsWith("II*\0"u8))
        {
            little = true;
        }
        else if (tiff.StartsWith("MM\0*"u8))
        {
            little = false;
        }
        else
        {
            return Upright;
        }

        long directory = U32(tiff, 4, little);
        if (directory + 2 > tiff.Length)
        {
            return Upright;
        }

        var entries = U16(tiff, (int)directory, little);
        for (var i = 0; i < entries; i++)
        {
            var entry = directory + 2 + (12L * i);
            if (entry + 12 > tiff.Length)
            {
                break;
            }

            var at = (int)entry;
            if (U16(tiff, at, little) != OrientationTag || U32(tiff, at + 4, little) < 1)
            {
                continue;
            }

            var type = U16(tiff, at + 2, little);
            long value = type == TypeShort ? U16(tiff, at + 8, little) : type == TypeLong ? U32(tiff, at + 8, little) : Upright;
            return value is >= 1 and <= 8 ? (int)value : Upright;
        }

        return Upright;
    }

    /// <summary>Turns stored pixels upright for orientation <paramref name="orientation"/> and clears the tag.</summary>
    public static void Apply(Image image, int orientation)
    {
        switch (orientation)
        {
            case 2: image.Mutate(x => x.Flip(FlipMode.Horizontal)); break;
            case 3: image.Mutate(x => x.Rotate(RotateMode.Rotate180)); break;
            case 4: image.Mutate(x => x.Flip(FlipMode.Vertical)); break;
            case 5: image.Mutate(x => x.Rotate(RotateMode.Rotate90).Flip(FlipMode.Horizontal)); break;
            case 6: image.Mutate(x => x.Rotate(RotateMode.Rotate90)); break;
            case 7: image.Mutate(x => x.Rotate(RotateMode.Rotate90).Flip(FlipMode.Vertical)); break;
            case 8: image.Mutate(x => x.Rotate(RotateMode.Rotate270)); break;
            default: break;
        }

        image.Metadata.ExifProfile?.RemoveValue(ExifTag.Orientation);
    }

    private static ushort U16(ReadOnlySpan<byte> data, int at, bool little) =>
        little ? BinaryPrimitives.ReadUInt16LittleEndian(data[at..]) : BinaryPrimitives.ReadUInt16BigEndian(data[at..]);

    private static uint U32(ReadOnlySpan<byte> data, int at, bool little) =>
        little ? BinaryPrimitives.ReadUInt32LittleEndian(data[at..]) : BinaryPrimitives.ReadUInt32BigEndian(data[at..]);
}

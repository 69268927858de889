using System.Buffers.Binary;

namespace Lookup.Imaging;

/// <summary>
/// Finds the TIFF-structured EXIF block of a photo in its bytes, without a metadata parser: the first APP1 "Exif"
/// segment of a JPEG (EXIF 2.3 section 4.5.4), the eXIf chunk of a PNG (PNG extensions 1.5.0), the EXIF chunk of a
/// WebP (RIFF container specification), or the TIFF file itself. The decoders run with metadata ignored, because
/// ImageSharp 2.1's metadata readers are where crafted files cost the most: 32 MiB of EXIF segments took 15 s and
/// then threw outside the decode, and a 64 KiB compressed PNG text chunk inflated to 64 MiB of text (measured).
/// Only the orientation is needed from all of it.
/// </summary>
internal static class ExifBlock
{
    /// <summary>The EXIF block, or an empty span when the photo has none (GIF and BMP never do).</summary>
    public static ReadOnlySpan<byte> Find(PhotoFormat format, ReadOnlySpan<byte> data) => format switch
    {
        PhotoFormat.Jpeg => InJpeg(data),
        PhotoFormat.Png => InPng(data),
        PhotoFormat.Webp => InWebp(data),
        PhotoFormat.Tiff => data,
        _ => [],
    };

    private static ReadOnlySpan<byte> InJpeg(ReadOnlySpan<byte> data)
    {
        // Segments follow SOI back to back until the start of scan; EXIF sits among the first of them.
        var position = 2;
        while (position + 4 <= data.Length && data[position] == 0xFF)
        {
            var marker = data[position + 1];
            if (marker is 0xD8 or 0x01 or (>= 0xD0 and <= 0xD7) or 0xFF)
            {
                position += marker == 0xFF ? 1 : 2;
                continue;
            }

            if (marker is 0xDA or 0xD9)
            {
                break;
            }

            var length = BinaryPrimitives.ReadUInt16BigEndian(data[(position + 2)..]);
            var end = position + 2 + length;
            if (length < 2 || end > data.Length)
            {
                break;
            }

            var body = data[(position + 4)..end];
            if (marker == 0xE1 && body.StartsWith("Exif\0\0"u8))
            {
                return body[6..];
            }

            position = end;
        }

        return [];
    }

    private static ReadOnlySpan<byte> InPng(ReadOnlySpan<byte> data)
    {
        long position = 8;
        while (position + 12 <= data.Length)
        {
            var at = (int)position;
            long length = BinaryPrimitives.ReadUInt32BigEndian(data[at..]);
            if (position + 12 + length > data.Length)
            {
                break;
            }

            var type = data.Slice(at + 4, 4);
            if (type.SequenceEqual("eXIf"u8))
            {
                return data.Slice(at + 8, (int)length);
            }

            if (type.SequenceEqual("IEND"u8))
            {
                break;
            }

            position += 12 + length;
        }

        return [];
    }

    private static ReadOnlySpan<byte> InWebp(ReadOnlySpan<byte> data)
    {
        long position = 12;
        while (position + 8 <= data.Length)
        {
            var at = (int)position;
            long size = BinaryPrimitives.ReadUInt32LittleEndian(data[(at + 4)..]);
            if (position + 8 + size > data.Length)
            {
                break;
            }

            if (data.Slice(at, 4).SequenceEqual("EXIF"u8))
            {
                var block = data.Slice(at + 8, (int)size);

                // Some writers keep the JPEG APP1 prefix.
                return block.StartsWith("Exif\0\0"u8) ? block[6..] : block;
            }

            position += 8 + size + (size & 1);
        }

        return [];
    }
}

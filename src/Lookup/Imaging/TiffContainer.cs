using System.Buffers.Binary;

namespace Lookup.Imaging;

/// <summary>
/// Walks the IFD chain of a classic TIFF file (TIFF 6.0, section 2) to count pages, and checks that the strips or
/// tiles of the first page lie inside the file. BigTIFF is left to the decoder and counted as one page.
/// </summary>
internal static class TiffContainer
{
    private const ushort ImageWidth = 256;
    private const ushort ImageLength = 257;
    private const ushort BitsPerSample = 258;
    private const ushort Compression = 259;
    private const ushort RowsPerStrip = 278;
    private const ushort StripOffsets = 273;
    private const ushort StripByteCounts = 279;
    private const ushort TileOffsets = 324;
    private const ushort TileByteCounts = 325;
    private const ushort TypeShort = 3;
    private const ushort TypeLong = 4;
    private const int MaxPages = 1_000_000;

    public static ContainerScan Scan(ReadOnlySpan<byte> data)
    {
        if (data.Length < 8)
        {
            return ContainerScan.Broken("no TIFF header");
        }

        var little = data[0] == (byte)'I' && data[1] == (byte)'I';
        var big = data[0] == (byte)'M' && data[1] == (byte)'M';
        if (!little && !big)
        {
            return ContainerScan.Broken("no TIFF byte-order mark");
        }

        var reader = new Reader(data, little);
        var version = reader.U16(2);
        if (version == 43)
        {
            return ContainerScan.Whole(1);
        }

        if (version != 42)
        {
            return ContainerScan.Broken($"unknown TIFF version {version}");
        }

        long offset = reader.U32(4);
        var pages = 0;
        while (offset != 0)
        {
            if (offset + 2 > data.Length)
            {
                return ContainerScan.Broken("a page directory lies beyond the end of the file");
            }

            var entries = reader.U16((int)offset);
            var next = offset + 2 + (12L * entries);
            if (next + 4 > data.Length)
            {
                return ContainerScan.Broken("ends inside a page directory");
            }

            if (pages == 0 && !PixelDataFits(reader, (int)offset + 2, entries, data.Length))
            {
                return ContainerScan.Broken("the first page's image data lies beyond the end of the file");
            }

            if (pages == 0 && FirstValueBeyondEnd(reader, (int)offset + 2, entries, data.Length) is { } tag)
            {
                return ContainerScan.Broken($"the value of tag {tag} lies beyond the end of the file");
            }

            if (pages == 0 && UncompressedShortfall(reader, (int)offset + 2, entries) is { } shortfall)
            {
                return ContainerScan.Broken($"its uncompressed strips hold {shortfall.Have:N0} bytes, its declared size needs {shortfall.Need:N0}");
            }

            pages++;
            var following = (long)reader.U32((int)next);
            if (pages > MaxPages || following == offset)
            {
                return ContainerScan.Broken("the page directories form a loop");
            }

            offset = following;
        }

        return pages > 0 ? ContainerScan.Whole(pages) : ContainerScan.Broken("has no page");
    }

    /// <summary>
    /// The first tag of a directory whose value is stored out of line (more than 4 bytes, TIFF 6.0 section 2) and
    /// does not fit in the file, or null. A file cut inside such a value (often the last thing a writer puts down)
    /// is truncated even when its pixels are whole.
    /// </summary>
    private static ushort? FirstValueBeyondEnd(Reader reader, int first, int entries, long length)
    {
        for (var i = 0; i < entries; i++)
        {
            var entry = first + (12 * i);
            long bytes = (long)reader.U32(entry + 4) * TypeBytes(reader.U16(entry + 2));
            if (bytes > 4 && reader.U32(entry + 8) + bytes > length)
            {
                return reader.U16(entry);
            }
        }

        return null;
    }

    /// <summary>Bytes per value of a TIFF 6.0 field type (section 2, "Types"); 0 for unknown types, which are skipped.</summary>
    private static int TypeBytes(ushort type) => type switch
    {
        1 or 2 or 6 or 7 => 1,
        3 or 8 => 2,
        4 or 9 or 11 or 13 => 4,
        5 or 10 or 12 => 8,
        _ => 0,
    };

    /// <summary>
    /// The file with the first page's RowsPerStrip lowered to its ImageLength when it is larger, or the file as it
    /// is. TIFF 6.0 allows a larger value (one strip holds the whole image), but ImageSharp 2.1 sizes its strip
    /// buffer by it: RowsPerStrip 8,388,608 on a 40 × 27 image took 2.7 s and 1 GB (found by the fuzz run;
    /// 2^32 − 1, the default, is handled). Lowering it changes no pixel. Call only on a file whose scan was whole.
    /// </summary>
    public static ReadOnlyMemory<byte> ClampRowsPerStrip(ReadOnlyMemory<byte> content)
    {
        var data = content.Span;
        var little = data[0] == (byte)'I';
        var reader = new Reader(data, little);
        if (reader.U16(2) != 42)
        {
            return content;
        }

        var directory = (int)reader.U32(4);
        var entries = reader.U16(directory);
        long height = -1;
        var rowsEntry = -1;
        for (var i = 0; i < entries; i++)
        {
            var entry = directory + 2 + (12 * i);
            var tag = reader.U16(entry);
            if (tag == ImageLength)
            {
                height = reader.Value(entry, 0);
            }
            else if (tag == RowsPerStrip)
            {
                rowsEntry = entry;
            }
        }

        if (rowsEntry < 0 || height <= 0 || reader.Value(rowsEntry, 0) <= height)
        {
            return content;
        }

        var patched = content.ToArray();
        var value = patched.AsSpan(rowsEntry + 2);
        if (little)
        {
            BinaryPrimitives.WriteUInt16LittleEndian(value, TypeLong);
            BinaryPrimitives.WriteUInt32LittleEndian(value[2..], 1);
            BinaryPrimitives.WriteUInt32LittleEndian(value[6..], (uint)height);
        }
        else
        {
            BinaryPrimitives.WriteUInt16BigEndian(value, TypeLong);
            BinaryPrimitives.WriteUInt32BigEndian(value[2..], 1);
            BinaryPrimitives.WriteUInt32BigEndian(value[6..], (uint)height);
        }

        return patched;
    }

    /// <summary>
    /// For an uncompressed page in strips, the bytes its strips hold and the bytes its declared size needs (rows ×
    /// ⌈width × bits per pixel / 8⌉, TIFF 6.0 section 3) when they hold fewer, else null. ImageSharp fills what is
    /// missing, so a 3 KB file declaring 40 × 2,097,179 decoded to 84 MP in 1–2 s (found by the fuzz run).
    /// </summary>
    private static (long Have, long Need)? UncompressedShortfall(Reader reader, int first, int entries)
    {
        long width = -1, height = -1, compression = 1, bitsPerPixel = 0;
        int counts = -1;
        for (var i = 0; i < entries; i++)
        {
            var entry = first + (12 * i);
            switch (reader.U16(entry))
            {
                case ImageWidth: width = reader.Value(entry, 0); break;
                case ImageLength: height = reader.Value(entry, 0); break;
                case Compression: compression = reader.Value(entry, 0); break;
                case StripByteCounts: counts = entry; break;
                case TileByteCounts: return null;
                case BitsPerSample:
                    for (long k = 0; k < Math.Min(reader.U32(entry + 4), 16u); k++)
                    {
                        bitsPerPixel += Math.Max(reader.Value(entry, k), 0);
                    }

                    break;
            }
        }

        if (compression != 1 || counts < 0 || width <= 0 || height <= 0)
        {
            return null;
        }

        var rowBytes = ((width * Math.Max(bitsPerPixel, 1)) + 7) / 8;
        var need = height > long.MaxValue / rowBytes ? long.MaxValue : height * rowBytes;
        long have = 0;
        for (long k = 0; k < reader.U32(counts + 4) && have < need; k++)
        {
            have += Math.Max(reader.Value(counts, k), 0);
        }

        return have < need ? (have, need) : null;
    }

    private static bool PixelDataFits(Reader reader, int first, int entries, long length)
    {
        int offsets = -1, counts = -1;
        for (var i = 0; i < entries; i++)
        {
            var entry = first + (12 * i);
            var tag = reader.U16(entry);
            if (tag is StripOffsets or TileOffsets)
            {
                offsets = entry;
            }
            else if (tag is StripByteCounts or TileByteCounts)
            {
                counts = entry;
            }
        }

        if (offsets < 0 || counts < 0)
        {
            return true;
        }

        var count = reader.U32(offsets + 4);
        if (count != reader.U32(counts + 4))
        {
            return true;
        }

        for (long i = 0; i < count; i++)
        {
            var start = reader.Value(offsets, i);
            var size = reader.Value(counts, i);
            if (start < 0 || size < 0 || start + size > length)
            {
                return false;
            }
        }

        return true;
    }

    private readonly ref struct Reader(ReadOnlySpan<byte> data, bool little)
    {
        private readonly ReadOnlySpan<byte> data = data;

        public ushort U16(int at) => little
            ? BinaryPrimitives.ReadUInt16LittleEndian(data[at..])
            : BinaryPrimitives.ReadUInt16BigEndian(data[at..]);

        public uint U32(int at) => little
            ? BinaryPrimitives.ReadUInt32LittleEndian(data[at..])
            : BinaryPrimitives.ReadUInt32BigEndian(data[at..]);

        /// <summary>Element <paramref name="index"/> of a SHORT or LONG array entry; -1 when it lies outside the file.</summary>
        public long Value(int entry, long index)
        {
            var type = U16(entry + 2);
            var count = U32(entry + 4);
            var width = type == TypeShort ? 2 : type == TypeLong ? 4 : 0;
            if (width == 0)
            {
                return -1;
            }

            long start = count * width <= 4 ? entry + 8 : U32(entry + 8);
            var at = start + (index * width);
            if (at + width > data.Length)
            {
                return -1;
            }

            return width == 2 ? U16((int)at) : U32((int)at);
        }
    }
}

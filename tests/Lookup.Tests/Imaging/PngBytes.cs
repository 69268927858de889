using System.Buffers.Binary;
using System.IO.Compression;
using System.Text;

namespace Lookup.Tests.Imaging;

/// <summary>
/// Writes PNG files chunk by chunk (ISO/IEC 15948: signature, then length, type, data, CRC-32 per chunk), so tests
/// can build files no encoder would write: huge declared sizes, odd chunks, damaged checksums.
/// </summary>
internal sealed class PngBytes
{
    private static readonly uint[] CrcTable = BuildCrcTable();
    private readonly MemoryStream _stream = new();

    public PngBytes() => _stream.Write([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]);

    /// <summary>Appends an IHDR chunk: size, bit depth, colour type (2 = RGB), no interlace.</summary>
    public PngBytes Header(uint width, uint height, byte bitDepth = 8, byte colourType = 2)
    {
        var data = new byte[13];
        BinaryPrimitives.WriteUInt32BigEndian(data, width);
        BinaryPrimitives.WriteUInt32BigEndian(data.AsSpan(4), height);
        data[8] = bitDepth;
        data[9] = colourType;
        return Chunk("IHDR", data);
    }

    /// <summary>Appends an IDAT chunk holding <paramref name="raw"/> compressed with zlib.</summary>
    public PngBytes Data(byte[] raw) => Chunk("IDAT", Zlib(raw));

    /// <summary>Appends a chunk with a correct CRC.</summary>
    public PngBytes Chunk(string type, byte[] data)
    {
        Span<byte> word = stackalloc byte[4];
        BinaryPrimitives.WriteInt32BigEndian(word, data.Length);
        _stream.Write(word);
        var typed = Encoding.ASCII.GetBytes(type).Concat(data).ToArray();
        _stream.Write(typed);
        BinaryPrimitives.WriteUInt32BigEndian(word, Crc32(typed));
        _stream.Write(word);
        return this;
    }

    /// <summary>Appends IEND and returns the file.</summary>
    public byte[] End() => Chunk("IEND", []).ToArray();

    public byte[] ToArray() => _stream.ToArray();

    public static byte[] Zlib(byte[] raw)
    {
        using var zlib = new MemoryStream();
        using (var deflate = new ZLibStream(zlib, CompressionLevel.SmallestSize, leaveOpen: true))
        {
            deflate.Write(raw);
        }

        return zlib.ToArray();
    }

    /// <summary>CRC-32 as PNG defines it (ISO/IEC 15948 annex D): polynomial 0xEDB88320, reflected.</summary>
    public static uint Crc32(ReadOnlySpan<byte> data)
    {
        var crc = 0xFFFFFFFFu;
        foreach (var b in data)
        {
            crc = CrcTable[(crc ^ b) & 0xFF] ^ (crc >> 8);
        }

        return ~crc;
    }

    private static uint[] BuildCrcTable()
    {
        var table = new uint[256];
        for (uint n = 0; n < 256; n++)
        {
            var c = n;
            for (var k = 0; k < 8; k++)
            {
                c = (c & 1) != 0 ? 0xEDB88320u ^ (c >> 1) : c >> 1;
            }

            table[n] = c;
        }

        return table;
    }
}

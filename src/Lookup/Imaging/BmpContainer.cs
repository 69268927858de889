using System.Buffers.Binary;

namespace Lookup.Imaging;

/// <summary>
/// Checks that a BMP file holds all the pixel rows its header declares (BITMAPINFOHEADER layout: rows padded to
/// 4 bytes). Compressed variants that state no image size are left to the decoder.
/// </summary>
internal static class BmpContainer
{
    private const uint Uncompressed = 0;
    private const uint BitFields = 3;
    private const uint AlphaBitFields = 6;

    public static ContainerScan Scan(ReadOnlySpan<byte> data)
    {
        if (data.Length < 26 || !data.StartsWith("BM"u8))
        {
            return ContainerScan.Broken("no BMP header");
        }

        long pixelOffset = BinaryPrimitives.ReadUInt32LittleEndian(data[10..]);
        var headerSize = BinaryPrimitives.ReadUInt32LittleEndian(data[14..]);
        long width, height, bitsPerPixel;
        uint compression;
        long declaredImageBytes;
        if (headerSize == 12)
        {
            width = BinaryPrimitives.ReadUInt16LittleEndian(data[18..]);
            height = BinaryPrimitives.ReadUInt16LittleEndian(data[20..]);
            bitsPerPixel = BinaryPrimitives.ReadUInt16LittleEndian(data[24..]);
            compression = Uncompressed;
            declaredImageBytes = 0;
        }
        else if (headerSize >= 40 && data.Length >= 54)
        {
            width = BinaryPrimitives.ReadInt32LittleEndian(data[18..]);
            height = Math.Abs((long)BinaryPrimitives.ReadInt32LittleEndian(data[22..]));
            bitsPerPixel = BinaryPrimitives.ReadUInt16LittleEndian(data[28..]);
            compression = BinaryPrimitives.ReadUInt32LittleEndian(data[30..]);
            declaredImageBytes = BinaryPrimitives.ReadUInt32LittleEndian(data[34..]);
        }
        else
        {
            return ContainerScan.Broken($"unknown header size {headerSize}");
        }

        var isRaw = compression is Uncompressed or BitFields or AlphaBitFields;
        var imageBytes = isRaw ? ((width * bitsPerPixel + 31) / 32) * 4 * height : declaredImageBytes;
        var needed = pixelOffset + imageBytes;
        return needed > data.Length
            ? ContainerScan.Broken($"the header declares {needed:N0} bytes but the file has {data.Length:N0}")
            : ContainerScan.Whole(1);
    }
}

namespace Lookup.Imaging;

/// <summary>
/// Walks GIF blocks (GIF89a specification, sections 17–27) counting image descriptors. Sub-blocks are skipped by
/// their length bytes, so no pixel is decoded. A file that ends at a block boundary after at least one frame is
/// accepted without its trailer byte, as browsers do; one that ends inside a block is truncated.
/// </summary>
internal static class GifContainer
{
    private const byte ExtensionIntroducer = 0x21;
    private const byte ImageSeparator = 0x2C;
    private const byte Trailer = 0x3B;

    public static ContainerScan Scan(ReadOnlySpan<byte> data)
    {
        if (data.Length < 13 || !(data.StartsWith("GIF87a"u8) || data.StartsWith("GIF89a"u8)))
        {
            return ContainerScan.Broken("no GIF header");
        }

        var position = 13 + ColourTableBytes(data[10]);
        var frames = 0;
        (int Width, int Height) largest = default;
        while (true)
        {
            if (position >= data.Length)
            {
                return frames > 0 ? ContainerScan.Whole(frames, largest) : ContainerScan.Broken("ends before the first frame");
            }

            switch (data[position])
            {
                case Trailer:
                    return frames > 0 ? ContainerScan.Whole(frames, largest) : ContainerScan.Broken("has no frame");
                case ExtensionIntroducer:
                    position = SkipSubBlocks(data, position + 2);
                    break;
                case ImageSeparator:
                    if (position + 11 > data.Length)
                    {
                        return ContainerScan.Broken("ends inside an image descriptor");
                    }

                    frames++;
                    largest = Larger(largest, (data[position + 5] | (data[position + 6] << 8), data[position + 7] | (data[position + 8] << 8)));
                    position = SkipSubBlocks(data, position + 10 + ColourTableBytes(data[position + 9]) + 1);
                    break;
                default:
                    // Bytes after complete frames are tolerated (some writers pad); before any frame they are not.
                    return frames > 0 ? ContainerScan.Whole(frames, largest) : ContainerScan.Broken($"unexpected block 0x{data[position]:X2}");
            }

            if (position < 0)
            {
                return ContainerScan.Broken("ends inside a data block");
            }
        }
    }

    /// <summary>
    /// An image descriptor may declare a frame far larger than the logical screen the header reports (GIF89a
    /// section 20 places no bound), so the largest one is kept for the pixel limit.
    /// </summary>
    private static (int Width, int Height) Larger((int Width, int Height) a, (int Width, int Height) b) =>
        (long)b.Width * b.Height > (long)a.Width * a.Height ? b : a;

    private static int ColourTableBytes(byte packed) => (packed & 0x80) != 0 ? 3 << ((packed & 0x07) + 1) : 0;

    /// <summary>Returns the offset after the terminating zero-length sub-block, or -1 when data ends first.</summary>
    private static int SkipSubBlocks(ReadOnlySpan<byte> data, int position)
    {
        while (position < data.Length)
        {
            var size = data[position];
            position += 1 + size;
            if (size == 0)
            {
                return position;
            }
        }

        return -1;
    }
}

namespace Lookup.Imaging;

/// <summary>
/// Walks JPEG marker segments (ITU-T T.81 annex B) from SOI to EOI, skipping entropy-coded data after each SOS.
/// In entropy-coded data a 0xFF byte is followed by 0x00 (stuffing) or a restart marker, so the next other marker
/// ends the scan. A file that ends before EOI is truncated.
/// </summary>
internal static class JpegContainer
{
    private const byte Marker = 0xFF;
    private const byte StartOfImage = 0xD8;
    private const byte EndOfImage = 0xD9;
    private const byte StartOfScan = 0xDA;

    public static ContainerScan Scan(ReadOnlySpan<byte> data)
    {
        if (data.Length < 4 || data[0] != Marker || data[1] != StartOfImage)
        {
            return ContainerScan.Broken("no start-of-image marker");
        }

        var position = 2;
        while (true)
        {
            var found = data[position..].IndexOf(Marker);
            if (found < 0)
            {
                return ContainerScan.Broken("ends before the end-of-image marker");
            }

            position += found;
            while (position < data.Length && data[position] == Marker)
            {
                position++;
            }

            if (position >= data.Length)
            {
                return ContainerScan.Broken("ends before the end-of-image marker");
            }

            var marker = data[position++];
            if (marker == EndOfImage)
            {
                return ContainerScan.Whole(1);
            }

            if (IsStandalone(marker))
            {
                continue;
            }

            if (position + 2 > data.Length)
            {
                return ContainerScan.Broken("ends inside a segment header");
            }

            var length = (data[position] << 8) | data[position + 1];
            if (length < 2)
            {
                return ContainerScan.Broken($"segment 0xFF{marker:X2} declares length {length}");
            }

            if (position + length > data.Length)
            {
                return ContainerScan.Broken($"ends inside segment 0xFF{marker:X2}");
            }

            position += length;
            if (marker == StartOfScan)
            {
                position = SkipEntropyCodedData(data, position);
                if (position < 0)
                {
                    return ContainerScan.Broken("ends inside the compressed image data, before the end-of-image marker");
                }
            }
        }
    }

    private static bool IsStandalone(byte marker) =>
        marker == 0x01 || marker == StartOfImage || (marker >= 0xD0 && marker <= 0xD7);

    /// <summary>Returns the offset of the 0xFF that starts the next marker, or -1 at end of data.</summary>
    private static int SkipEntropyCodedData(ReadOnlySpan<byte> data, int position)
    {
        while (true)
        {
            var found = data[position..].IndexOf(Marker);
            if (found < 0 || position + found + 1 >= data.Length)
            {
                return -1;
            }

            var at = position + found;
            var next = data[at + 1];
            var isStuffingOrRestart = next == 0x00 || (next >= 0xD0 && next <= 0xD7);
            if (!isStuffingOrRestart)
            {
                return at;
            }

            position = at + 2;
        }
    }
}

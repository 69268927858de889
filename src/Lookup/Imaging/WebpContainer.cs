using System.Buffers.Binary;

namespace Lookup.Imaging;

/// <summary>
/// Walks the RIFF chunks of a WebP file (RFC 9649, section 2) and counts ANMF frames. The RIFF header states the
/// file size, so a file shorter than it is truncated.
/// </summary>
internal static class WebpContainer
{
    public static ContainerScan Scan(ReadOnlySpan<byte> data)
    {
        if (data.Length < 12 || !data.StartsWith("RIFF"u8) || !data[8..].StartsWith("WEBP"u8))
        {
            return ContainerScan.Broken("no RIFF/WEBP header");
        }

        long end = 8L + BinaryPrimitives.ReadUInt32LittleEndian(data[4..]);
        if (end > data.Length)
        {
            return ContainerScan.Broken($"the header declares {end:N0} bytes but the file has {data.Length:N0}");
        }

        var frames = 0;
        long position = 12;
        while (position + 8 <= end)
        {
            var at = (int)position;
            long size = BinaryPrimitives.ReadUInt32LittleEndian(data[(at + 4)..]);
            if (data.Slice(at, 4).SequenceEqual("ANMF"u8))
            {
                frames++;
            }

            position += 8 + size + (size & 1);
            if (position > end)
            {
                return ContainerScan.Broken("ends inside a chunk");
            }
        }

        return ContainerScan.Whole(frames);
    }
}

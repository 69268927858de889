using System.Buffers.Binary;

namespace Lookup.Imaging;

/// <summary>
/// Walks PNG chunks (ISO/IEC 15948, section 5) from the signature to IEND. The frame count comes from an APNG
/// acTL chunk when present; only the default image is decoded.
/// </summary>
internal static class PngContainer
{
    private static ReadOnlySpan<byte> Signature => [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];

    public static ContainerScan Scan(ReadOnlySpan<byte> data)
    {
        if (!data.StartsWith(Signature))
        {
            return ContainerScan.Broken("no PNG signature");
        }

        var frames = 1;
        long position = Signature.Length;
        while (true)
        {
            if (position + 12 > data.Length)
            {
                return ContainerScan.Broken("ends before the IEND chunk");
            }

            var at = (int)position;
            long length = BinaryPrimitives.ReadUInt32BigEndian(data[at..]);
            var type = data.Slice(at + 4, 4);
            if (position + 12 + length > data.Length)
            {
                return ContainerScan.Broken($"ends inside the {System.Text.Encoding.ASCII.GetString(type)} chunk");
            }

            if (type.SequenceEqual("IEND"u8))
            {
                return ContainerScan.Whole(frames);
            }

            if (type.SequenceEqual("acTL"u8) && length >= 4)
            {
                frames = (int)Math.Min(BinaryPrimitives.ReadUInt32BigEndian(data[(at + 8)..]), int.MaxValue);
            }

            position += 12 + length;
        }
    }
}

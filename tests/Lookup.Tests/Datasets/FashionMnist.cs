using System.Buffers.Binary;
using System.IO.Compression;

namespace Lookup.Tests.Datasets;

/// <summary>
/// Reads Fashion-MNIST (Xiao, Rasul &amp; Vollgraf 2017, https://github.com/zalandoresearch/fashion-mnist, MIT)
/// in its idx format: big-endian magic (0x803 images / 0x801 labels), counts, then bytes. Also writes a subset
/// in the same format, for the copy committed under tests/reference-data/fashion-mnist/.
/// </summary>
internal static class FashionMnist
{
    public const int Side = 28;
    public const int Pixels = Side * Side;

    /// <summary>The ten class names, in label order (from the dataset's README).</summary>
    public static readonly string[] ClassNames =
        ["T-shirt/top", "Trouser", "Pullover", "Dress", "Coat", "Sandal", "Shirt", "Sneaker", "Bag", "Ankle boot"];

    /// <summary>The Debian package's copy (dataset-fashion-mnist).</summary>
    public const string DebianDirectory = "/usr/share/datasets/fashion-mnist";

    /// <summary>Up to <paramref name="max"/> images of 28×28 grey bytes from an idx3 file (gzip or plain).</summary>
    public static byte[][] ReadImages(string path, int max = int.MaxValue)
    {
        using var stream = OpenMaybeGzip(path);
        Span<byte> header = stackalloc byte[16];
        stream.ReadExactly(header);
        int magic = BinaryPrimitives.ReadInt32BigEndian(header);
        int count = BinaryPrimitives.ReadInt32BigEndian(header[4..]);
        int rows = BinaryPrimitives.ReadInt32BigEndian(header[8..]);
        int cols = BinaryPrimitives.ReadInt32BigEndian(header[12..]);
        if (magic != 0x803 || rows != Side || cols != Side)
        {
            throw new InvalidDataException($"{path} is not an idx3 image file of 28×28 images (magic 0x{magic:x}, {rows}×{cols}).");
        }

        var images = new byte[Math.Min(count, max)][];
        for (int i = 0; i < images.Length; i++)
        {
            images[i] = new byte[Pixels];
            stream.ReadExactly(images[i]);
        }

        return images;
    }

    /// <summary>Up to <paramref name="max"/> labels (0..9) from an idx1 file (gzip or plain).</summary>
    public static byte[] ReadLabels(string path, int max = int.MaxValue)
    {
        using var stream = OpenMaybeGzip(path);
        Span<byte> header = stackalloc byte[8];
        stream.ReadExactly(header);
        int magic = BinaryPrimitives.ReadInt32BigEndian(header);
        int count = BinaryPrimitives.ReadInt32BigEndian(header[4..]);
        if (magic != 0x801)
        {
            throw new InvalidDataException($"{path} is not an idx1 label file (magic 0x{magic:x}).");
        }

        var labels = new byte[Math.Min(count, max)];
        stream.ReadExactly(labels);
        return labels;
    }

    /// <summary>Writes images and labels as gzip idx files (the upstream format, with the subset's count).</summary>
    public static void WriteSubset(string imagesPath, string labelsPath, IReadOnlyList<byte[]> images, IReadOnlyList<byte> labels)
    {
        using (var images3 = new GZipStream(File.Create(imagesPath), CompressionLevel.SmallestSize))
        {
            Span<byte> header = stackalloc byte[16];
            BinaryPrimitives.WriteInt32BigEndian(header, 0x803);
            BinaryPrimitives.WriteInt32BigEndian(header[4..], images.Count);
            BinaryPrimitives.WriteInt32BigEndian(header[8..], Side);
            BinaryPrimitives.WriteInt32BigEndian(header[12..], Side);
            images3.Write(header);
            foreach (var image in images)
            {
                images3.Write(image);
            }
        }

        using var labels1 = new GZipStream(File.Create(labelsPath), CompressionLevel.SmallestSize);
        Span<byte> labelHeader = stackalloc byte[8];
        BinaryPrimitives.WriteInt32BigEndian(labelHeader, 0x801);
        BinaryPrimitives.WriteInt32BigEndian(labelHeader[4..], labels.Count);
        labels1.Write(labelHeader);
        labels1.Write(labels.ToArray());
    }

    private static Stream OpenMaybeGzip(string path)
    {
        var file = File.OpenRead(path);
        return path.EndsWith(".gz", StringComparison.Ordinal) ? new GZipStream(file, CompressionMode.Decompress) : file;
    }
}

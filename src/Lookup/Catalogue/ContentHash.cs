using System.Buffers;
using System.Security.Cryptography;

namespace Lookup.Catalogue;

/// <summary>Streaming SHA-256 of a file's content, with a pooled read buffer (no whole-file allocation).</summary>
internal static class ContentHash
{
    // Large enough that a photo takes a handful of reads, small enough to stay out of the large-object heap.
    private const int BufferSize = 64 * 1024;

    /// <summary>The lower-case hex SHA-256 of the file at <paramref name="path"/>.</summary>
    public static string Sha256Hex(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete,
            bufferSize: 0, FileOptions.SequentialScan);
        return Sha256Hex(stream);
    }

    /// <summary>The lower-case hex SHA-256 of the rest of <paramref name="stream"/>.</summary>
    public static string Sha256Hex(Stream stream)
    {
        ArgumentNullException.ThrowIfNull(stream);
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        var buffer = ArrayPool<byte>.Shared.Rent(BufferSize);
        try
        {
            int read;
            while ((read = stream.Read(buffer, 0, BufferSize)) > 0)
            {
                hash.AppendData(buffer, 0, read);
            }
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(buffer);
        }

        Span<byte> digest = stackalloc byte[SHA256.HashSizeInBytes];
        hash.GetHashAndReset(digest);
        return Convert.ToHexStringLower(digest);
    }
}

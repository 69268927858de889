using System.Buffers.Binary;
using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace Lookup.Catalogue;

/// <summary>
/// Shard <see cref="Index"/> of <see cref="Count"/> (1-based, as job arrays number tasks): a photo belongs to the shard
/// chosen by a hash of its path relative to the catalogue root (the first 8 bytes of the SHA-256 of its UTF-8 bytes,
/// read as a little-endian integer, modulo N), so membership never depends on listing order, the machine or the run.
/// </summary>
internal sealed record ShardSpec(int Index, int Count)
{
    /// <summary>Parses <c>K/N</c> with 1 ≤ K ≤ N.</summary>
    public static ShardSpec Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        string[] parts = text.Split('/');
        if (parts.Length == 2
            && int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out int k)
            && int.TryParse(parts[1], NumberStyles.None, CultureInfo.InvariantCulture, out int n)
            && n >= 1 && k >= 1 && k <= n)
        {
            return new ShardSpec(k, n);
        }

        throw new FormatException($"'{text}' is not a shard: write K/N with 1 ≤ K ≤ N, e.g. --shard 2/8.");
    }

    /// <summary>True when the photo at <paramref name="relativePath"/> belongs to this shard.</summary>
    public bool Contains(string relativePath) => Of(relativePath, Count) == Index;

    /// <summary>The 1-based shard of <paramref name="relativePath"/> among <paramref name="count"/>.</summary>
    public static int Of(string relativePath, int count)
    {
        Span<byte> hash = stackalloc byte[32];
        SHA256.HashData(Encoding.UTF8.GetBytes(relativePath), hash);
        // Little-endian on every machine, so a shard is the same whichever node computes it.
        ulong key = BinaryPrimitives.ReadUInt64LittleEndian(hash);
        return (int)(key % (ulong)count) + 1;
    }

    /// <inheritdoc />
    public override string ToString() => $"{Index}/{Count}";
}

namespace Lookup.Tests.Imaging;

/// <summary>
/// A seeded byte-level mutator for fuzzing decoders: bit flips, overwrites with boundary values, 32-bit length-field
/// overwrites, truncation, deletion and duplication of a slice (which repeats chunks, segments and headers).
/// One to three edits per case. The same seed gives the same cases.
/// </summary>
internal sealed class ByteMutator(int seed)
{
    private static readonly byte[] Boundary = [0x00, 0x01, 0x7F, 0x80, 0xFE, 0xFF];
    private static readonly uint[] Lengths = [0, 1, 0x7FFF, 0xFFFF, 0x10000, 0x7FFFFFFF, 0x80000000, 0xFFFFFFFF];
    private readonly Random _random = new(seed);

    /// <summary>A mutated copy of <paramref name="original"/> and a description of the edits made.</summary>
    public (byte[] Bytes, string Edits) Mutate(byte[] original)
    {
        var bytes = original;
        var edits = new List<string>();
        var count = 1 + _random.Next(3);
        for (var i = 0; i < count && bytes.Length > 1; i++)
        {
            (bytes, var edit) = MutateOnce(bytes);
            edits.Add(edit);
        }

        return (bytes, string.Join(", ", edits));
    }

    private (byte[] Bytes, string Edit) MutateOnce(byte[] source)
    {
        var bytes = (byte[])source.Clone();
        var at = _random.Next(bytes.Length);
        switch (_random.Next(7))
        {
            case 0:
                var bit = _random.Next(8);
                bytes[at] ^= (byte)(1 << bit);
                return (bytes, $"flip bit {bit} at {at}");
            case 1:
                var value = Boundary[_random.Next(Boundary.Length)];
                bytes[at] = value;
                return (bytes, $"byte {at} = 0x{value:X2}");
            case 2:
                var random = (byte)_random.Next(256);
                bytes[at] = random;
                return (bytes, $"byte {at} = 0x{random:X2}");
            case 3:
                var length = Lengths[_random.Next(Lengths.Length)];
                var start = Math.Min(at, bytes.Length - 4);
                if (start < 0)
                {
                    return (bytes, "none");
                }

                var bigEndian = _random.Next(2) == 0;
                for (var k = 0; k < 4; k++)
                {
                    bytes[start + k] = (byte)(length >> (bigEndian ? 24 - (8 * k) : 8 * k));
                }

                return (bytes, $"{(bigEndian ? "big" : "little")}-endian 0x{length:X8} at {start}");
            case 4:
                var kept = 1 + _random.Next(bytes.Length - 1);
                return (bytes[..kept], $"cut to {kept}");
            case 5:
                var deleted = 1 + _random.Next(Math.Min(64, bytes.Length - at));
                return ([.. bytes.AsSpan(0, at), .. bytes.AsSpan(at + deleted)], $"delete {deleted} at {at}");
            default:
                var size = 1 + _random.Next(Math.Min(256, bytes.Length - at));
                var insertAt = _random.Next(bytes.Length + 1);
                return ([.. bytes.AsSpan(0, insertAt), .. bytes.AsSpan(at, size), .. bytes.AsSpan(insertAt)], $"copy {size} from {at} to {insertAt}");
        }
    }
}

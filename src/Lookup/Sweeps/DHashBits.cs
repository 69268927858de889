using System.Numerics;

namespace Lookup.Sweeps;

/// <summary>Bit arithmetic on 64-bit difference hashes (8 rows of 8 "right brighter than left" bits).</summary>
public static class DHashBits
{
    /// <summary>Number of differing bits.</summary>
    public static int Distance(ulong a, ulong b) => BitOperations.PopCount(a ^ b);

    /// <summary>
    /// The hash of the horizontally mirrored photo, derived from the hash alone. Mirroring reverses each row, so
    /// comparison k of a row becomes comparison 7 − k with its sides swapped: within each byte the bits are reversed
    /// and complemented. This holds for either bit order inside the byte, as long as each row fills one byte (the
    /// layout of <c>Lookup.Imaging.DifferenceHash</c>). Where two neighbouring samples are equal (flat backgrounds)
    /// both hashes hold 0 but the derived one holds 1, so for photos with flat areas the derived hash overstates the
    /// distance: a mirrored copy may be missed, never invented.
    /// </summary>
    public static ulong Mirror(ulong hash)
    {
        var x = hash;
        x = ((x >> 1) & 0x5555_5555_5555_5555UL) | ((x & 0x5555_5555_5555_5555UL) << 1);
        x = ((x >> 2) & 0x3333_3333_3333_3333UL) | ((x & 0x3333_3333_3333_3333UL) << 2);
        x = ((x >> 4) & 0x0F0F_0F0F_0F0F_0F0FUL) | ((x & 0x0F0F_0F0F_0F0F_0F0FUL) << 4);
        return ~x;
    }
}

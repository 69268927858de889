using System.Text;

namespace Lookup.DemoGenerator.Geometry;

/// <summary>FNV-1a over UTF-8: a string hash that does not change between processes (string.GetHashCode does).</summary>
internal static class StableHash
{
    public static ulong Of(string text)
    {
        ulong h = 14695981039346656037UL;
        foreach (byte b in Encoding.UTF8.GetBytes(text))
        {
            h = (h ^ b) * 1099511628211UL;
        }

        return h;
    }

    /// <summary>Mix integer coordinates into 32 well-spread bits (for per-pixel and lattice noise).</summary>
    public static uint Mix(uint a, uint b, uint c)
    {
        uint h = (a * 0x8DA6B343u) ^ (b * 0xD8163841u) ^ (c * 0xCB1AB31Fu);
        h ^= h >> 15;
        h *= 0x2C1B3C6Du;
        h ^= h >> 12;
        h *= 0x297A2D39u;
        h ^= h >> 15;
        return h;
    }
}

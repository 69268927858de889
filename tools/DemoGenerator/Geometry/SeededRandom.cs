namespace Lookup.DemoGenerator.Geometry;

/// <summary>
/// SplitMix64 (Steele, Lea and Flood, 2014): tiny, fast, and fixed by its definition, so a seed means the same
/// numbers on every runtime (System.Random's seeded sequence is a compatibility promise, not a specification).
/// </summary>
internal sealed class SeededRandom(ulong seed)
{
    private ulong _state = seed;

    /// <summary>A generator for one named purpose, independent of how many numbers other purposes drew.</summary>
    public static SeededRandom For(int seed, string purpose) => new(StableHash.Of(purpose) ^ (ulong)(uint)seed * 0x9E3779B97F4A7C15UL);

    public ulong NextUInt64()
    {
        ulong z = _state += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>Uniform in [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));

    public double Range(double min, double max) => min + ((max - min) * NextDouble());

    /// <summary>Uniform integer in [0, count).</summary>
    public int Next(int count) => (int)(NextUInt64() % (ulong)count);

    public T Pick<T>(IReadOnlyList<T> items) => items[Next(items.Count)];
}

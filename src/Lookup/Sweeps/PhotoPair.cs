namespace Lookup.Sweeps;

/// <summary>Two photos by their index in the sweep's photo list, <see cref="First"/> &lt; <see cref="Second"/>.</summary>
internal readonly record struct PhotoPair(int First, int Second)
{
    public long Packed => ((long)First << 32) | (uint)Second;

    public static PhotoPair Unpack(long packed) => new((int)(packed >> 32), (int)(packed & 0xFFFF_FFFF));
}

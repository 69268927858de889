namespace Lookup.Graph;

/// <summary>Where every search starts: a node on the top layer and that layer's number. Id −1 means the graph has no live node.</summary>
internal readonly record struct EntryPoint(int Id, int Level)
{
    public static EntryPoint None => new(-1, -1);

    public bool IsNone => Id < 0;

    /// <summary>Both fields in one long, so the writer can publish them in one atomic store.</summary>
    public long Pack() => ((long)Level << 32) | (uint)Id;

    public static EntryPoint Unpack(long packed) => packed == -1 ? None : new((int)(packed & 0xFFFF_FFFF), (int)(packed >> 32));
}

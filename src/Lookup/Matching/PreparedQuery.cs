using Lookup.Imaging;
using SixLabors.ImageSharp;

namespace Lookup.Matching;

/// <summary>A query photo read, hashed and decoded, waiting for the network: the part of a query that needs no model.</summary>
internal sealed class PreparedQuery(string path, string sha256, ulong differenceHash, DecodedPhoto photo, Rectangle[] regions) : IDisposable
{
    public string Path { get; } = path;

    public string Sha256 { get; } = sha256;

    public ulong DifferenceHash { get; } = differenceHash;

    public DecodedPhoto Photo { get; } = photo;

    /// <summary>The regions to embed, whole photo first.</summary>
    public Rectangle[] Regions { get; } = regions;

    public void Dispose() => Photo.Dispose();
}

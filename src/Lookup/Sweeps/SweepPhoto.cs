namespace Lookup.Sweeps;

/// <summary>
/// One live catalogue photo as the sweep sees it: what the index stores about it, nothing decoded.
/// </summary>
/// <param name="Id">The id the neighbour source knows the photo by (e.g. its graph node id). Unique per sweep.</param>
/// <param name="Sku">The SKU the photo is filed under.</param>
/// <param name="Path">Path relative to the catalogue root, '/' separated.</param>
/// <param name="Sha256">SHA-256 of the file's bytes as 64 hex digits (case ignored).</param>
/// <param name="DHash">64-bit difference hash: one byte per row of 8 adjacent-pixel comparisons, as
/// <c>Lookup.Imaging.DifferenceHash</c> lays it out (see <see cref="DHashBits.Mirror"/>).</param>
/// <param name="Width">Decoded width in pixels, after EXIF orientation.</param>
/// <param name="Height">Decoded height in pixels, after EXIF orientation.</param>
/// <param name="FileSize">File size in bytes.</param>
/// <param name="Embedding">The L2-normalised embedding (e.g. a slice of one contiguous array).</param>
/// <param name="Thumbnail">The 32 × 32 grey thumbnail stored at ingest, or null when the index has none (then
/// the sweep asks its thumbnail delegate, and without one falls back to the dHash alone).</param>
/// <param name="Detail">The 64 × 64 grey thumbnail stored at ingest, or null when the index has none yet (then a
/// copy rests on the 32 × 32 thumbnail alone, as before ingest stored it).</param>
/// <param name="Chroma">The 32 × 32 colour-difference planes stored at ingest, or null when the index has none yet.</param>
public sealed record SweepPhoto(
    int Id,
    string Sku,
    string Path,
    string Sha256,
    ulong DHash,
    int Width,
    int Height,
    long FileSize,
    ReadOnlyMemory<float> Embedding,
    GreyThumbnail? Thumbnail = null,
    DetailThumbnail? Detail = null,
    ChromaThumbnail? Chroma = null)
{
    /// <summary>Width over height; 1 when a dimension is unknown (zero).</summary>
    public double AspectRatio => Width > 0 && Height > 0 ? (double)Width / Height : 1.0;
}

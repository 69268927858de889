namespace Lookup.Catalogue;

/// <summary>The pixel evidence ingest stores for the sweep (see <see cref="PhotoThumbnail"/>).</summary>
/// <param name="Thumbnail">32 × 32 grey, 1,024 bytes.</param>
/// <param name="Detail">64 × 64 grey, 4,096 bytes.</param>
/// <param name="Chroma">32 × 32 Cb then Cr, 2,048 bytes.</param>
internal sealed record PhotoPixelEvidence(byte[] Thumbnail, byte[] Detail, byte[] Chroma);

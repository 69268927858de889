namespace Lookup.Imaging;

/// <summary>Facts about a decoded photo as it was stored.</summary>
/// <param name="Format">The container format.</param>
/// <param name="StoredWidth">Width in the file, before the EXIF orientation was applied.</param>
/// <param name="StoredHeight">Height in the file, before the EXIF orientation was applied.</param>
/// <param name="FileBytes">Size of the file in bytes.</param>
/// <param name="FrameCount">Frames or pages the file declares; only the first was decoded.</param>
/// <param name="Orientation">The EXIF orientation applied (1–8); 1 when absent or out of range.</param>
public sealed record PhotoInfo(PhotoFormat Format, int StoredWidth, int StoredHeight, long FileBytes, int FrameCount, int Orientation)
{
    /// <summary>Width after orientation: orientations 5–8 swap width and height.</summary>
    public int Width => Orientation >= 5 ? StoredHeight : StoredWidth;

    /// <summary>Height after orientation.</summary>
    public int Height => Orientation >= 5 ? StoredWidth : StoredHeight;
}

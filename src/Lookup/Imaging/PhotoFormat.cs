namespace Lookup.Imaging;

/// <summary>The container formats Lookup decodes.</summary>
public enum PhotoFormat
{
    /// <summary>JPEG (JFIF or EXIF), baseline or progressive, grey, YCbCr, CMYK or YCCK.</summary>
    Jpeg,

    /// <summary>PNG, any bit depth, palette, grey or colour, with or without alpha.</summary>
    Png,

    /// <summary>GIF; only the first frame is decoded.</summary>
    Gif,

    /// <summary>TIFF; only the first page is decoded.</summary>
    Tiff,

    /// <summary>WebP, lossy or lossless, still images.</summary>
    Webp,

    /// <summary>Windows bitmap.</summary>
    Bmp,
}

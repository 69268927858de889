namespace Lookup.Catalogue;

/// <summary>An image container recognised from a file's first bytes.</summary>
internal enum ImageFormat
{
    /// <summary>The content matches none of the signatures below.</summary>
    Unknown = 0,
    Jpeg,
    Png,
    Gif,
    Bmp,
    Tiff,
    WebP,
}

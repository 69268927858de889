using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Imaging;

/// <summary>
/// A photo decoded to 8-bit RGB, upright (EXIF orientation applied), alpha composited over white.
/// Owns its pixels: dispose it to return them to ImageSharp's pool.
/// </summary>
public sealed class DecodedPhoto : IDisposable
{
    internal DecodedPhoto(string path, Image<Rgb24> image, PhotoInfo info)
    {
        Path = path;
        Image = image;
        Info = info;
    }

    /// <summary>The file the photo came from, as given by the caller.</summary>
    public string Path { get; }

    /// <summary>The upright RGB pixels.</summary>
    public Image<Rgb24> Image { get; }

    /// <summary>Format, stored size, frames and orientation.</summary>
    public PhotoInfo Info { get; }

    /// <summary>The whole upright image as a rectangle, for region-based calls.</summary>
    public Rectangle Bounds => new(0, 0, Image.Width, Image.Height);

    /// <inheritdoc/>
    public void Dispose() => Image.Dispose();
}

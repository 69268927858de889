using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// Tiny real image files written by SixLabors.ImageSharp (a general-purpose reference encoder), so signature
/// checks run against what an independent encoder writes, not against bytes typed from our own reading of a spec.
/// </summary>
internal static class SampleImages
{
    public static byte[] Png(byte shade = 40) => Encode((image, s) => image.SaveAsPng(s), shade);

    public static byte[] Jpeg(byte shade = 40) => Encode((image, s) => image.SaveAsJpeg(s), shade);

    public static byte[] Gif(byte shade = 40) => Encode((image, s) => image.SaveAsGif(s), shade);

    public static byte[] Bmp(byte shade = 40) => Encode((image, s) => image.SaveAsBmp(s), shade);

    public static byte[] Tiff(byte shade = 40) => Encode((image, s) => image.SaveAsTiff(s), shade);

    public static byte[] WebP(byte shade = 40) => Encode((image, s) => image.SaveAsWebp(s), shade);

    private static byte[] Encode(Action<Image, Stream> save, byte shade)
    {
        using var image = new Image<Rgb24>(4, 3, new Rgb24(shade, (byte)(255 - shade), 128));
        using var stream = new MemoryStream();
        save(image, stream);
        return stream.ToArray();
    }
}

using System.Collections.Frozen;

namespace Lookup.Catalogue;

/// <summary>
/// Recognises image files by content (their leading signature bytes) and by name (their extension).
/// Content decides what a file is; the extension only decides whether a non-image is worth reporting.
/// </summary>
internal static class ImageSignature
{
    /// <summary>How many leading bytes <see cref="Detect"/> needs to tell every format apart.</summary>
    public const int HeaderLength = 12;

    // Extensions under which people save photos. HEIF/AVIF are listed although they cannot be read, so such
    // files are reported as failures instead of vanishing silently from the catalogue.
    private static readonly FrozenSet<string> ImageExtensions = FrozenSet.Create(
        StringComparer.OrdinalIgnoreCase,
        ".jpg", ".jpeg", ".jpe", ".jfif", ".png", ".gif", ".bmp", ".dib", ".tif", ".tiff", ".webp",
        ".heic", ".heif", ".avif");

    /// <summary>Names the format whose signature starts <paramref name="header"/>, or <see cref="ImageFormat.Unknown"/>.</summary>
    public static ImageFormat Detect(ReadOnlySpan<byte> header)
    {
        // JPEG: SOI marker FF D8 followed by the FF that opens the next marker (ITU-T T.81, annex B.1.1).
        if (header.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xD8, 0xFF]))
        {
            return ImageFormat.Jpeg;
        }

        // PNG: the fixed 8-byte signature (PNG specification, section 5.2).
        if (header.StartsWith((ReadOnlySpan<byte>)[0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]))
        {
            return ImageFormat.Png;
        }

        // GIF: "GIF87a" or "GIF89a" (GIF89a specification, section 17).
        if (header.StartsWith("GIF87a"u8) || header.StartsWith("GIF89a"u8))
        {
            return ImageFormat.Gif;
        }

        // BMP: BITMAPFILEHEADER starts "BM"; its two reserved WORDs at bytes 6..9 "must be zero" (Microsoft's
        // BITMAPFILEHEADER documentation). Checking them keeps text files that begin with "BM" out.
        if (header.Length >= 10 && header.StartsWith("BM"u8) && header[6..10].IndexOfAnyExcept((byte)0) < 0)
        {
            return ImageFormat.Bmp;
        }

        // TIFF: byte order "II" + 42 little-endian, or "MM" + 42 big-endian (TIFF 6.0, section 2).
        if (header.StartsWith("II*\0"u8) || header.StartsWith("MM\0*"u8))
        {
            return ImageFormat.Tiff;
        }

        // WebP: a RIFF container whose form type is "WEBP" (WebP container specification, "RIFF header").
        if (header.Length >= 12 && header.StartsWith("RIFF"u8) && header[8..12].SequenceEqual("WEBP"u8))
        {
            return ImageFormat.WebP;
        }

        return ImageFormat.Unknown;
    }

    /// <summary>True when the file name ends with an extension people use for photos (case-insensitive).</summary>
    public static bool HasImageExtension(string fileName) => ImageExtensions.Contains(Path.GetExtension(fileName));
}

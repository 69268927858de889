using System.Text;
using Lookup.Catalogue;
using SixLabors.ImageSharp;

namespace Lookup.Tests.Catalogue;

public sealed class ImageSignatureTests
{
    [Theory]
    [InlineData("Png")]
    [InlineData("Jpeg")]
    [InlineData("Gif")]
    [InlineData("Bmp")]
    [InlineData("Tiff")]
    [InlineData("WebP")]
    public void Detect_recognises_files_written_by_an_independent_encoder(string formatName)
    {
        var expected = Enum.Parse<ImageFormat>(formatName);
        var bytes = Sample(expected);

        Assert.Equal(expected, ImageSignature.Detect(bytes.AsSpan(0, ImageSignature.HeaderLength)));
        // Cross-check with ImageSharp's own format detection (a reference library).
        Assert.Equal(expected.ToString(), Image.DetectFormat(bytes).Name, ignoreCase: true);
    }

    // Signatures typed from the specifications for variants the encoder above does not write.
    [Theory]
    [InlineData("474946383761", "Gif")] // "GIF87a": GIF89a specification, section 17 (older version tag).
    [InlineData("4D4D002A00000008", "Tiff")] // "MM" + 42 big-endian: TIFF 6.0, section 2.
    [InlineData("49492A0008000000", "Tiff")] // "II" + 42 little-endian: TIFF 6.0, section 2.
    [InlineData("FFD8FFE1", "Jpeg")] // SOI then an APP1 (Exif) marker: ITU-T T.81 annex B, Exif 2.3.
    public void Detect_recognises_signature_variants_from_the_specifications(string hex, string expected)
    {
        Assert.Equal(Enum.Parse<ImageFormat>(expected), ImageSignature.Detect(Convert.FromHexString(hex)));
    }

    [Theory]
    [InlineData("", "Unknown")]
    [InlineData("FFD8", "Unknown")] // Too short to hold the marker after SOI.
    [InlineData("89504E470D0A1A", "Unknown")] // PNG signature cut one byte short.
    [InlineData("424D000000", "Unknown")] // "BM" without the reserved bytes.
    [InlineData("474946383961", "Gif")] // Exactly "GIF89a", nothing after it.
    public void Detect_handles_short_headers_without_throwing(string hex, string expected)
    {
        Assert.Equal(Enum.Parse<ImageFormat>(expected), ImageSignature.Detect(Convert.FromHexString(hex)));
    }

    [Theory]
    [InlineData("BMW parts list, spring\n")] // Starts with "BM" but its reserved header bytes are not zero.
    [InlineData("RIFF\0\0\0\0WAVEfmt ")] // A RIFF container that is audio, not WebP.
    [InlineData("hello, this is text")]
    [InlineData("%PDF-1.7\n")]
    public void Detect_rejects_content_that_only_resembles_an_image(string text)
    {
        Assert.Equal(ImageFormat.Unknown, ImageSignature.Detect(Encoding.ASCII.GetBytes(text)));
    }

    [Theory]
    [InlineData("a.jpg", true)]
    [InlineData("A.JPEG", true)]
    [InlineData("b/c.Png", true)]
    [InlineData("x.tif", true)]
    [InlineData("phone.heic", true)]
    [InlineData("notes.txt", false)]
    [InlineData("jpg", false)]
    [InlineData("archive.jpg.zip", false)]
    public void HasImageExtension_goes_by_the_last_extension_ignoring_case(string name, bool expected)
    {
        Assert.Equal(expected, ImageSignature.HasImageExtension(name));
    }

    private static byte[] Sample(ImageFormat format) => format switch
    {
        ImageFormat.Png => SampleImages.Png(),
        ImageFormat.Jpeg => SampleImages.Jpeg(),
        ImageFormat.Gif => SampleImages.Gif(),
        ImageFormat.Bmp => SampleImages.Bmp(),
        ImageFormat.Tiff => SampleImages.Tiff(),
        _ => SampleImages.WebP(),
    };
}

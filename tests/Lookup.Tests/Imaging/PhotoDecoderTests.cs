using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Bmp;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Formats.Webp;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Imaging;

public sealed class PhotoDecoderTests : IDisposable
{
    private readonly PhotoDecoder decoder = new();
    private readonly TestPhotos photos = new();

    // Reference files from python3-skimage (skimage/data) and opencv-doc (examples/data); see tests/reference-data/SOURCES.md.
    [Theory]
    [InlineData("skimage/camera.png", PhotoFormat.Png, 512, 512, 1)] // 8-bit grey
    [InlineData("opencv/basketball1.png", PhotoFormat.Png, 640, 480, 1)] // 8-bit grey
    [InlineData("opencv/imageTextN.png", PhotoFormat.Png, 556, 257, 1)] // 8-bit palette
    [InlineData("skimage/palette_color.png", PhotoFormat.Png, 10, 10, 1)] // palette
    [InlineData("skimage/palette_gray.png", PhotoFormat.Png, 10, 10, 1)] // grey palette
    [InlineData("opencv/opencv-logo.png", PhotoFormat.Png, 600, 794, 1)] // RGBA
    [InlineData("opencv/mask.png", PhotoFormat.Png, 128, 128, 1)] // grey + alpha
    [InlineData("skimage/no_time_for_that_tiny.gif", PhotoFormat.Gif, 14, 25, 24)] // animated GIF
    [InlineData("skimage/multipage_rgb.tif", PhotoFormat.Tiff, 10, 10, 2)] // two-page RGB TIFF
    [InlineData("skimage/chessboard_GRAY_U16.tif", PhotoFormat.Tiff, 200, 200, 1)] // 16-bit grey, little-endian
    [InlineData("skimage/chessboard_GRAY_U16B.tif", PhotoFormat.Tiff, 200, 200, 1)] // 16-bit grey, big-endian
    [InlineData("skimage/rocket.jpg", PhotoFormat.Jpeg, 640, 427, 1)] // baseline YCbCr JPEG
    [InlineData("generated/chelsea-cmyk.jpg", PhotoFormat.Jpeg, 451, 300, 1)] // CMYK JPEG
    public void Decode_reads_every_reference_pixel_format_as_rgb(string file, PhotoFormat format, int width, int height, int frames)
    {
        using var photo = decoder.Decode(Path.Combine(ReferenceData.Root, file));

        Assert.Equal(new PhotoInfo(format, width, height, new FileInfo(Path.Combine(ReferenceData.Root, file)).Length, frames, 1), photo.Info);
        Assert.Equal(new Size(width, height), photo.Image.Size());
    }

    [Fact]
    public void Decode_keeps_only_the_first_frame_of_an_animated_gif()
    {
        // skimage/data/no_time_for_that_tiny.gif: 24 frames; ImageSharp's own full decode gives the reference frame.
        var path = ReferenceData.SkImage("no_time_for_that_tiny.gif");
        using var all = Image.Load<Rgb24>(path);
        using var first = all.Frames.CloneFrame(0);

        using var photo = decoder.Decode(path);

        Assert.Equal(24, all.Frames.Count);
        Assert.Equal(1, photo.Image.Frames.Count);
        Assert.Equal(0, TestPhotos.MeanAbsoluteDifference(first, photo.Image));
    }

    [Fact]
    public void Decode_converts_a_cmyk_jpeg_to_the_colours_of_its_rgb_source()
    {
        // chelsea-cmyk.jpg was made from skimage chelsea.png by ImageMagick (-colorspace CMYK -quality 92).
        using var cmyk = decoder.Decode(ReferenceData.Generated("chelsea-cmyk.jpg"));
        using var rgb = decoder.Decode(ReferenceData.SkImage("chelsea.png"));

        Assert.InRange(TestPhotos.MeanAbsoluteDifference(cmyk.Image, rgb.Image), 0, 6);
    }

    [Fact]
    public void Decode_reads_16_bit_tiff_the_same_in_both_byte_orders()
    {
        using var little = decoder.Decode(ReferenceData.SkImage("chessboard_GRAY_U16.tif"));
        using var big = decoder.Decode(ReferenceData.SkImage("chessboard_GRAY_U16B.tif"));

        Assert.Equal(0, TestPhotos.MeanAbsoluteDifference(little.Image, big.Image));
        Assert.True(little.Image[0, 0].R != little.Image[199, 0].R || little.Image[0, 0].R != little.Image[0, 199].R, "a chessboard is not flat");
    }

    [Fact]
    public void Decode_composites_transparent_pixels_over_white()
    {
        // opencv-logo.png: RGBA with fully transparent corners (opencv-doc).
        using var photo = decoder.Decode(ReferenceData.OpenCv("opencv-logo.png"));

        Assert.Equal(new Rgb24(255, 255, 255), photo.Image[0, 0]);
        Assert.Equal(new Rgb24(255, 255, 255), photo.Image[599, 793]);
    }

    [Fact]
    public void Decode_blends_half_transparent_pixels_with_white()
    {
        using var image = new Image<Rgba32>(4, 4, new Rgba32(0, 0, 200, 128));
        var path = photos.Save("half.png", image, new PngEncoder { ColorType = PngColorType.RgbWithAlpha });

        using var photo = decoder.Decode(path);

        // 0·128/255 + 255·127/255 = 127; 200·128/255 + 127 = 227.4 (rounded to nearest).
        Assert.Equal(new Rgb24(127, 127, 227), photo.Image[1, 1]);
    }

    [Fact]
    public void Decode_reads_16_bit_png_webp_and_bmp_written_from_a_reference_photo()
    {
        // Half size keeps the slow lossy WebP encoder of ImageSharp 2.1 under a second.
        using var original = decoder.Decode(ReferenceData.SkImage("coffee.png"));
        using var source = original.Image.Clone(x => x.Resize(300, 200));
        using var deep = source.CloneAs<Rgba64>();
        var png16 = photos.Save("coffee16.png", deep, new PngEncoder { BitDepth = PngBitDepth.Bit16, ColorType = PngColorType.Rgb });
        var lossless = photos.Save("coffee.webp", source, new WebpEncoder { FileFormat = WebpFileFormatType.Lossless });
        var lossy = photos.Save("coffee-lossy.webp", source, new WebpEncoder { FileFormat = WebpFileFormatType.Lossy, Quality = 90 });
        var bmp = photos.Save("coffee.bmp", source, new BmpEncoder { BitsPerPixel = BmpBitsPerPixel.Pixel24 });

        foreach (var (path, format, tolerance) in new[] { (png16, PhotoFormat.Png, 0.0), (lossless, PhotoFormat.Webp, 0.0), (bmp, PhotoFormat.Bmp, 0.0), (lossy, PhotoFormat.Webp, 5.0) })
        {
            using var photo = decoder.Decode(path);
            Assert.Equal(format, photo.Info.Format);
            Assert.InRange(TestPhotos.MeanAbsoluteDifference(source, photo.Image), 0, tolerance);
        }
    }

    [Fact]
    public void Decode_of_bytes_in_memory_matches_decode_of_the_file()
    {
        var path = ReferenceData.SkImage("rocket.jpg");
        using var fromFile = decoder.Decode(path);
        using var fromBytes = decoder.Decode(File.ReadAllBytes(path), path);

        Assert.Equal(fromFile.Info, fromBytes.Info);
        Assert.Equal(0, TestPhotos.MeanAbsoluteDifference(fromFile.Image, fromBytes.Image));
    }

    public void Dispose() => photos.Dispose();
}

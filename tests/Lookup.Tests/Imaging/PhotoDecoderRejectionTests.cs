using System.IO.Compression;
using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Bmp;
using SixLabors.ImageSharp.Formats.Gif;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Formats.Tiff;
using SixLabors.ImageSharp.Formats.Webp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Imaging;

public sealed class PhotoDecoderRejectionTests : IDisposable
{
    private readonly TestPhotos photos = new();

    [Fact]
    public void Decode_rejects_a_zero_byte_file_as_empty() =>
        AssertRejected(photos.Write("empty.jpg", []), PhotoRejectionReason.EmptyFile);

    [Fact]
    public void Decode_rejects_a_text_file_named_jpg_as_unknown_format() =>
        AssertRejected(photos.Write("notes.jpg", "Part 4471-B, brake caliper, left\n"u8.ToArray()), PhotoRejectionReason.UnknownFormat);

    [Fact]
    public void Decode_rejects_the_truncated_jpeg_shipped_with_skimage() =>
        // skimage/data/truncated.jpg: a JPEG cut inside its Huffman table segment (python3-skimage).
        AssertRejected(ReferenceData.SkImage("truncated.jpg"), PhotoRejectionReason.Corrupt);

    [Theory]
    [InlineData(0.5)]
    [InlineData(0.9)]
    [InlineData(0.999)]
    public void Decode_rejects_a_jpeg_cut_short_although_imagesharp_would_fill_it_with_black(double kept)
    {
        var bytes = File.ReadAllBytes(ReferenceData.SkImage("rocket.jpg"));
        AssertRejected(photos.Write("cut.jpg", bytes[..(int)(bytes.Length * kept)]), PhotoRejectionReason.Corrupt);
    }

    [Fact]
    public void Decode_rejects_a_png_header_declaring_40000_by_40000_before_decoding() =>
        AssertRejected(photos.Write("bomb.png", PngDeclaring(40_000, 40_000)), PhotoRejectionReason.TooManyPixels, "1600 MP");

    [Theory]
    [InlineData("png")]
    [InlineData("gif")]
    [InlineData("webp")]
    [InlineData("bmp")]
    [InlineData("tif")]
    public void Decode_rejects_every_format_cut_short(string extension)
    {
        using var source = Image.Load<Rgb24>(ReferenceData.SkImage("chelsea.png"));
        using var stream = new MemoryStream();
        source.Save(stream, extension switch
        {
            "png" => new PngEncoder(),
            "gif" => new GifEncoder(),
            "webp" => new WebpEncoder(),
            "bmp" => new BmpEncoder(),
            _ => new TiffEncoder(),
        });
        var bytes = stream.ToArray();

        AssertRejected(photos.Write("cut." + extension, bytes[..(bytes.Length * 9 / 10)]), PhotoRejectionReason.Corrupt);
    }

    [Fact]
    public void Decode_rejects_a_missing_file_as_unreadable() =>
        AssertRejected(Path.Combine(photos.Directory, "missing.jpg"), PhotoRejectionReason.Unreadable);

    [Fact]
    public void Decode_rejects_a_folder_as_unreadable() =>
        AssertRejected(photos.Directory, PhotoRejectionReason.Unreadable);

    [Fact]
    public void Decode_rejects_a_file_over_the_size_limit() =>
        AssertRejected(ReferenceData.SkImage("rocket.jpg"), PhotoRejectionReason.FileTooLarge, "100,000 bytes", new PhotoLimits { MaxFileBytes = 100_000 });

    [Fact]
    public void Decode_rejects_a_photo_over_the_pixel_limit() =>
        AssertRejected(ReferenceData.SkImage("rocket.jpg"), PhotoRejectionReason.TooManyPixels, "640 × 427", new PhotoLimits { MaxPixels = 640 * 427 - 1 });

    [Fact]
    public void Decode_rejects_an_animation_over_the_frame_limit() =>
        // skimage/data/no_time_for_that_tiny.gif declares 24 frames (counted by walking its blocks).
        AssertRejected(ReferenceData.SkImage("no_time_for_that_tiny.gif"), PhotoRejectionReason.TooManyFrames, "24 frames", new PhotoLimits { MaxFrames = 23 });

    [Fact]
    public void Decode_rejects_a_multipage_tiff_over_the_frame_limit() =>
        AssertRejected(ReferenceData.SkImage("multipage_rgb.tif"), PhotoRejectionReason.TooManyFrames, "2 frames", new PhotoLimits { MaxFrames = 1 });

    [Fact]
    public void Decode_gives_up_when_the_time_limit_has_passed() =>
        AssertRejected(ReferenceData.SkImage("rocket.jpg"), PhotoRejectionReason.TimedOut, "time limit", new PhotoLimits { DecodeTimeout = TimeSpan.Zero });

    [Fact]
    public void Decode_accepts_a_photo_exactly_at_every_limit()
    {
        var path = ReferenceData.SkImage("rocket.jpg");
        var limits = new PhotoLimits { MaxPixels = 640 * 427, MaxFileBytes = new FileInfo(path).Length, MaxFrames = 1 };

        using var photo = new PhotoDecoder(limits).Decode(path);

        Assert.Equal(640, photo.Image.Width);
    }

    public void Dispose() => photos.Dispose();

    private static void AssertRejected(string path, PhotoRejectionReason reason, string? detail = null, PhotoLimits? limits = null)
    {
        var decoder = new PhotoDecoder(limits);
        var rejection = Assert.Throws<PhotoRejectedException>(() => decoder.Decode(path).Dispose());

        Assert.Equal(reason, rejection.Reason);
        Assert.Equal(path, rejection.Path);
        Assert.StartsWith(path + ": ", rejection.Message, StringComparison.Ordinal);
        if (detail is not null)
        {
            Assert.Contains(detail, rejection.Message, StringComparison.Ordinal);
        }
    }

    /// <summary>A well-formed PNG (valid CRCs, a small IDAT, IEND) whose header claims the given size.</summary>
    private static byte[] PngDeclaring(int width, int height)
    {
        using var png = new MemoryStream();
        png.Write([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]);
        var header = new byte[13];
        System.Buffers.Binary.BinaryPrimitives.WriteInt32BigEndian(header, width);
        System.Buffers.Binary.BinaryPrimitives.WriteInt32BigEndian(header.AsSpan(4), height);
        header[8] = 8; // bit depth
        header[9] = 2; // colour type RGB
        WriteChunk(png, "IHDR", header);
        using (var zlib = new MemoryStream())
        {
            using (var deflate = new ZLibStream(zlib, CompressionLevel.SmallestSize, leaveOpen: true))
            {
                deflate.Write(new byte[64 * 1024]);
            }

            WriteChunk(png, "IDAT", zlib.ToArray());
        }

        WriteChunk(png, "IEND", []);
        return png.ToArray();
    }

    private static void WriteChunk(Stream stream, string type, byte[] data)
    {
        Span<byte> word = stackalloc byte[4];
        System.Buffers.Binary.BinaryPrimitives.WriteInt32BigEndian(word, data.Length);
        stream.Write(word);
        var typed = System.Text.Encoding.ASCII.GetBytes(type).Concat(data).ToArray();
        stream.Write(typed);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32BigEndian(word, Crc32(typed));
        stream.Write(word);
    }

    /// <summary>CRC-32 as PNG defines it (ISO/IEC 15948 annex D): polynomial 0xEDB88320, reflected.</summary>
    private static uint Crc32(byte[] data)
    {
        var crc = 0xFFFFFFFFu;
        foreach (var b in data)
        {
            crc ^= b;
            for (var k = 0; k < 8; k++)
            {
                crc = (crc & 1) != 0 ? 0xEDB88320u ^ (crc >> 1) : crc >> 1;
            }
        }

        return ~crc;
    }
}

using System.Buffers.Binary;
using System.IO.Compression;
using System.Text;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats;
using SixLabors.ImageSharp.Formats.Gif;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Formats.Tiff;
using SixLabors.ImageSharp.Formats.Webp;
using SixLabors.ImageSharp.Metadata.Profiles.Exif;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Imaging;

/// <summary>
/// The hostile corpus: broken, crafted and odd photo files generated from code (nothing large is committed).
/// Seeds are the scikit-image photos chelsea.png and rocket.jpg (tests/reference-data, python3-skimage) encoded by
/// SixLabors.ImageSharp, a general-purpose reference encoder; crafted files are written byte by byte from the
/// format specifications (JPEG ITU-T T.81 markers, PNG ISO/IEC 15948 chunks, GIF89a blocks, TIFF 6.0 directories,
/// WebP RIFF chunks). Every case says whether it must be indexed or with which reason it must be refused.
/// </summary>
internal static class HostilePhotos
{
    private const string Corrupt = "Corrupt";
    private const string TooManyPixels = "TooManyPixels";
    private const string TooManyFrames = "TooManyFrames";
    private const string UnknownFormat = "UnknownFormat";

    private static readonly Lazy<IReadOnlyList<HostilePhoto>> Cases = new(() => Build(2026));

    /// <summary>Every case, in a fixed order (random bytes from a fixed seed); built once per process.</summary>
    public static IReadOnlyList<HostilePhoto> All() => Cases.Value;

    private static IReadOnlyList<HostilePhoto> Build(int seed)
    {
        var random = new Random(seed);
        var jpeg = Seed(new JpegEncoder { Quality = 90 });
        var png = Seed(new PngEncoder());
        var gif = Seed(new GifEncoder());
        var webp = Seed(new WebpEncoder { FileFormat = WebpFileFormatType.Lossy });
        var tiff = Seed(new TiffEncoder());
        var list = new List<HostilePhoto>();

        // Truncation at many offsets: ImageSharp fills missing rows with black, so each must be caught by the walk.
        list.Add(new("cut-jpg-2.jpg", jpeg[..2], UnknownFormat, "JPEG cut to its first 2 bytes (too short for the 3-byte signature)"));
        list.Add(new("cut-jpg-3.jpg", jpeg[..3], UnknownFormat, "JPEG cut to its 3-byte signature (too short for the decoder to recognise)"));
        list.AddRange(Cuts("jpg", jpeg, [20, 200, jpeg.Length / 4, jpeg.Length / 2, jpeg.Length * 3 / 4, jpeg.Length - 2, jpeg.Length - 1]));
        list.AddRange(Cuts("png", png, [8, 33, png.Length / 2, png.Length - 12, png.Length - 1]));
        list.AddRange(Cuts("gif", gif, [6, 13, gif.Length / 2, gif.Length - 2]));
        list.AddRange(Cuts("webp", webp, [12, 20, webp.Length / 2, webp.Length - 1]));
        list.AddRange(Cuts("tif", tiff, [8, tiff.Length / 2, tiff.Length - 2]));

        // Damaged inside, length intact.
        list.Add(new("png-bad-crc.png", FlipByteIn(png, "IDAT"u8, 20), Corrupt, "PNG whose image data no longer matches its CRC-32"));
        list.Add(new("png-garbage-zlib.png", new PngBytes().Header(64, 64).Chunk("IDAT", RandomBytes(random, 2000)).End(), Corrupt, "PNG whose IDAT is random bytes with a valid CRC"));
        list.Add(new("png-zero-width.png", new PngBytes().Header(0, 64).Data(new byte[65]).End(), Corrupt, "PNG header declaring width 0"));
        list.Add(new("jpeg-bad-huffman.jpg", Overwrite(jpeg, Segment(jpeg, 0xC4) + 5, Enumerable.Repeat((byte)0xFF, 16).ToArray()), Corrupt, "JPEG whose Huffman table counts are all 255"));
        list.Add(new("jpeg-then-html.jpg", [0xFF, 0xD8, 0xFF, .. "<html><body>not a photo</body></html>"u8], Corrupt, "JPEG signature followed by HTML"));
        list.Add(new("webp-garbage-vp8.webp", Overwrite(webp, 30, RandomBytes(random, Math.Min(200, webp.Length - 40))), Corrupt, "WebP whose VP8 bitstream is random bytes"));
        list.Add(new("tiff-strips-short.tif", TiffUncompressedDeclaring(40, 2_097_179), Corrupt, "uncompressed TIFF of 3 KB declaring 40 × 2,097,179 (84 MP, under the pixel limit)"));
        list.Add(new("tiff-strip-beyond-end.tif", TiffDeclaring(64, 64, stripOffset: 1_000_000), Corrupt, "TIFF whose strip lies beyond the end of the file"));
        list.Add(new("gif-no-frame.gif", [.. gif.AsSpan(0, 13 + 3 * 256), 0x3B], Corrupt, "GIF with a header and a trailer and no frame"));

        // Decompression bombs: huge declared sizes over tiny data, refused from the header.
        list.Add(new("bomb-png-40000.png", new PngBytes().Header(40_000, 40_000).Data(new byte[64 * 1024]).End(), TooManyPixels, "PNG declaring 40,000 × 40,000"));
        list.Add(new("bomb-png-tall.png", new PngBytes().Header(1, int.MaxValue).Data(new byte[64 * 1024]).End(), TooManyPixels, "PNG declaring 1 × 2,147,483,647"));
        list.Add(new("bomb-jpeg-65500.jpg", JpegDeclaring(jpeg, 65_500, 65_500), TooManyPixels, "JPEG whose frame header declares 65,500 × 65,500"));
        list.Add(new("bomb-gif-screen.gif", Gif(65_535, 65_535, frames: 1, frameWidth: 1, frameHeight: 1), TooManyPixels, "GIF whose logical screen is 65,535 × 65,535"));
        list.Add(new("bomb-gif-frame.gif", Gif(1, 1, frames: 1, frameWidth: 20_000, frameHeight: 20_000), TooManyPixels, "GIF with a 1 × 1 screen whose frame declares 20,000 × 20,000"));
        list.Add(new("bomb-webp-vp8l.webp", WebpLossless(16_384, 16_384, canvas: null), TooManyPixels, "lossless WebP declaring 16,384 × 16,384"));
        list.Add(new("bomb-webp-canvas.webp", WebpLossless(16_384, 16_384, canvas: (1, 1)), TooManyPixels, "WebP whose extended header says 1 × 1 and whose bitstream says 16,384 × 16,384"));
        list.Add(new("bomb-tiff.tif", TiffDeclaring(100_000, 100_000, stripOffset: null), TooManyPixels, "deflated TIFF declaring 100,000 × 100,000"));

        // Frames: only the first is decoded, and the count is limited before anything is decoded.
        list.Add(new("gif-10000-frames.gif", Gif(1, 1, frames: 10_000, frameWidth: 1, frameHeight: 1), TooManyFrames, "animated GIF of 10,000 frames"));
        list.Add(new("apng-2g-frames.png", ApngDeclaring(int.MaxValue), TooManyFrames, "APNG whose animation control chunk declares 2,147,483,647 frames"));

        // Not images at all, under image names.
        list.Add(new("empty.jpg", [], "EmptyFile", "zero bytes"));
        list.Add(new("notes.jpg", "Bremssattel links, Teil 4471-B\n"u8.ToArray(), UnknownFormat, "plain text named .jpg"));
        list.Add(new("page.png", "<!DOCTYPE html><html><script>alert(1)</script></html>"u8.ToArray(), UnknownFormat, "HTML named .png"));
        list.Add(new("archive.webp", Zip(), UnknownFormat, "ZIP archive named .webp"));
        list.Add(new("noise.tif", RandomBytes(random, 4096), UnknownFormat, "random bytes named .tif"));

        // Odd but genuine photos: these must be indexed.
        list.Add(new("exif-orientation-0.jpg", WithOrientation(0), null, "JPEG with EXIF orientation 0 (taken as upright)"));
        list.Add(new("exif-orientation-9.jpg", WithOrientation(9), null, "JPEG with EXIF orientation 9 (taken as upright)"));
        list.Add(new("exif-huge-count.jpg", WithApp1(jpeg, 1, ExifDeclaringEntries(random)), null, "JPEG whose EXIF directory declares 65,535 entries in a 64 KiB block"));
        list.Add(new("exif-32mib.jpg", WithApp1(jpeg, 512, ExifDeclaringEntries(random)), null, "JPEG with 512 EXIF segments (32 MiB of EXIF)"));
        list.Add(new("ztxt-bomb.png", WithChunkAfterHeader(png, "zTXt", [.. "Comment"u8, 0, 0, .. PngBytes.Zlib(new byte[64 << 20])]), null, "PNG with a compressed text chunk that inflates to 64 MiB"));
        list.Add(new("cmyk.jpg", File.ReadAllBytes(ReferenceData.Generated("chelsea-cmyk.jpg")), null, "CMYK JPEG"));
        list.Add(new("rgb-16bit.png", Encode(Resized(96, 64).CloneAs<Rgb48>(), new PngEncoder { BitDepth = PngBitDepth.Bit16 }), null, "16-bit RGB PNG"));
        list.Add(new("grey-16bit.tif", File.ReadAllBytes(ReferenceData.SkImage("chessboard_GRAY_U16.tif")), null, "16-bit grey TIFF (scikit-image chessboard)"));
        list.Add(new("one-pixel.png", Encode(new Image<Rgb24>(1, 1, new Rgb24(200, 30, 30)), new PngEncoder()), null, "1 × 1 PNG"));
        list.Add(new("one-by-10000.png", Encode(Stripe(1, 10_000), new PngEncoder()), null, "1 × 10,000 PNG"));
        list.Add(new("10000-by-one.jpg", Encode(Stripe(10_000, 1), new JpegEncoder()), null, "10,000 × 1 JPEG"));
        list.Add(new("gif-trailer-missing.gif", gif[..^1], null, "GIF whose trailer byte is missing (every frame complete)"));
        list.Add(new("tiff-rows-per-strip-8m.tif", TiffWithRowsPerStrip(tiff, 8_388_608), null, "TIFF whose RowsPerStrip is 8,388,608 (legal: one strip; cost 1 GB before it was lowered)"));
        list.Add(new("tiff-padding-missing.tif", tiff[..^1], null, "TIFF missing its last byte, the word-alignment pad after the last value"));
        return list;
    }

    private static IEnumerable<HostilePhoto> Cuts(string extension, byte[] bytes, int[] offsets) =>
        offsets.Select(kept => new HostilePhoto(
            $"cut-{extension}-{kept}.{extension}", bytes[..kept], Corrupt, $"{extension.ToUpperInvariant()} cut to {kept:N0} of {bytes.Length:N0} bytes"));

    private static byte[] Seed(IImageEncoder encoder) => Encode(Resized(160, 106), encoder);

    private static Image<Rgb24> Resized(int width, int height)
    {
        var image = Image.Load<Rgb24>(ReferenceData.SkImage("chelsea.png"));
        image.Mutate(x => x.Resize(width, height));
        return image;
    }

    private static Image<Rgb24> Stripe(int width, int height)
    {
        var image = new Image<Rgb24>(width, height);
        for (var y = 0; y < height; y++)
        {
            for (var x = 0; x < width; x++)
            {
                image[x, y] = new Rgb24((byte)(x * 7), (byte)(y * 13), 90);
            }
        }

        return image;
    }

    private static byte[] Encode(Image image, IImageEncoder encoder)
    {
        using (image)
        {
            using var stream = new MemoryStream();
            image.Save(stream, encoder);
            return stream.ToArray();
        }
    }

    private static byte[] WithOrientation(ushort orientation)
    {
        var image = Resized(120, 80);
        image.Metadata.ExifProfile = new ExifProfile();
        image.Metadata.ExifProfile.SetValue(ExifTag.Orientation, orientation);
        return Encode(image, new JpegEncoder());
    }

    private static byte[] RandomBytes(Random random, int count)
    {
        var bytes = new byte[count];
        random.NextBytes(bytes);
        return bytes;
    }

    private static byte[] Overwrite(byte[] bytes, int at, byte[] patch)
    {
        var copy = (byte[])bytes.Clone();
        patch.CopyTo(copy, at);
        return copy;
    }

    /// <summary>Offset of the first JPEG marker 0xFF <paramref name="marker"/> (its 0xFF byte).</summary>
    private static int Segment(byte[] jpeg, byte marker)
    {
        for (var i = 2; i + 1 < jpeg.Length; i++)
        {
            if (jpeg[i] == 0xFF && jpeg[i + 1] == marker)
            {
                return i;
            }
        }

        throw new InvalidOperationException($"no 0xFF{marker:X2} marker in the seed JPEG");
    }

    private static byte[] JpegDeclaring(byte[] jpeg, ushort width, ushort height)
    {
        var copy = (byte[])jpeg.Clone();
        var sof = Segment(copy, 0xC0);
        BinaryPrimitives.WriteUInt16BigEndian(copy.AsSpan(sof + 5), height);
        BinaryPrimitives.WriteUInt16BigEndian(copy.AsSpan(sof + 7), width);
        return copy;
    }

    /// <summary>Inserts <paramref name="count"/> APP1 segments holding <paramref name="exif"/> right after SOI.</summary>
    private static byte[] WithApp1(byte[] jpeg, int count, byte[] exif)
    {
        using var stream = new MemoryStream();
        stream.Write(jpeg.AsSpan(0, 2));
        for (var i = 0; i < count; i++)
        {
            stream.Write([0xFF, 0xE1, (byte)((exif.Length + 2) >> 8), (byte)(exif.Length + 2)]);
            stream.Write(exif);
        }

        stream.Write(jpeg.AsSpan(2));
        return stream.ToArray();
    }

    /// <summary>An APP1 body: "Exif\0\0", a little-endian TIFF header, IFD0 declaring 65,535 entries, then random bytes.</summary>
    private static byte[] ExifDeclaringEntries(Random random)
    {
        var body = RandomBytes(random, 65_533 - 2);
        "Exif\0\0II*\0"u8.CopyTo(body);
        BinaryPrimitives.WriteUInt32LittleEndian(body.AsSpan(10), 8);
        BinaryPrimitives.WriteUInt16LittleEndian(body.AsSpan(14), ushort.MaxValue);
        return body;
    }

    private static byte[] FlipByteIn(byte[] png, ReadOnlySpan<byte> chunkType, int offsetInData)
    {
        var copy = (byte[])png.Clone();
        var at = png.AsSpan().IndexOf(chunkType);
        copy[at + 4 + offsetInData] ^= 0x5A;
        return copy;
    }

    private static byte[] WithChunkAfterHeader(byte[] png, string type, byte[] data)
    {
        const int afterHeader = 8 + 25;
        var chunk = new PngBytes().Chunk(type, data).ToArray()[8..];
        return [.. png.AsSpan(0, afterHeader), .. chunk, .. png.AsSpan(afterHeader)];
    }

    private static byte[] ApngDeclaring(int frames)
    {
        var control = new byte[8];
        BinaryPrimitives.WriteInt32BigEndian(control, frames);
        var rows = new byte[8 * (1 + (8 * 3))];
        return new PngBytes().Header(8, 8).Chunk("acTL", control).Data(rows).End();
    }

    /// <summary>
    /// A GIF89a with a 2-colour global table and <paramref name="frames"/> frames, each a graphic control extension
    /// and an image descriptor of the given size holding the LZW codes for one pixel (clear, 0, end).
    /// </summary>
    private static byte[] Gif(ushort width, ushort height, int frames, ushort frameWidth, ushort frameHeight)
    {
        using var stream = new MemoryStream();
        stream.Write("GIF89a"u8);
        Span<byte> word = stackalloc byte[2];
        BinaryPrimitives.WriteUInt16LittleEndian(word, width);
        stream.Write(word);
        BinaryPrimitives.WriteUInt16LittleEndian(word, height);
        stream.Write(word);
        stream.Write([0x80, 0, 0, 0, 0, 0, 255, 255, 255]);
        for (var i = 0; i < frames; i++)
        {
            stream.Write([0x21, 0xF9, 0x04, 0x00, 0x01, 0x00, 0x00, 0x00]);
            stream.Write([0x2C, 0, 0, 0, 0]);
            BinaryPrimitives.WriteUInt16LittleEndian(word, frameWidth);
            stream.Write(word);
            BinaryPrimitives.WriteUInt16LittleEndian(word, frameHeight);
            stream.Write(word);
            stream.Write([0x00, 0x02, 0x02, 0x44, 0x01, 0x00]);
        }

        stream.WriteByte(0x3B);
        return stream.ToArray();
    }

    /// <summary>
    /// A WebP whose lossless bitstream header (signature 0x2F, 14-bit width − 1, 14-bit height − 1) declares the
    /// given size over a few random-looking bytes, optionally behind a VP8X chunk declaring another canvas size.
    /// </summary>
    private static byte[] WebpLossless(int width, int height, (int Width, int Height)? canvas)
    {
        var vp8l = new byte[64];
        vp8l[0] = 0x2F;
        var bits = (uint)(width - 1) | ((uint)(height - 1) << 14);
        BinaryPrimitives.WriteUInt32LittleEndian(vp8l.AsSpan(1), bits);
        using var body = new MemoryStream();
        body.Write("WEBP"u8);
        if (canvas is { } c)
        {
            var vp8x = new byte[10];
            WriteUInt24(vp8x.AsSpan(4), c.Width - 1);
            WriteUInt24(vp8x.AsSpan(7), c.Height - 1);
            WriteRiffChunk(body, "VP8X", vp8x);
        }

        WriteRiffChunk(body, "VP8L", vp8l);
        using var file = new MemoryStream();
        file.Write("RIFF"u8);
        Span<byte> size = stackalloc byte[4];
        BinaryPrimitives.WriteUInt32LittleEndian(size, (uint)body.Length);
        file.Write(size);
        file.Write(body.ToArray());
        return file.ToArray();
    }

    private static void WriteRiffChunk(Stream stream, string type, byte[] data)
    {
        stream.Write(Encoding.ASCII.GetBytes(type));
        Span<byte> size = stackalloc byte[4];
        BinaryPrimitives.WriteUInt32LittleEndian(size, (uint)data.Length);
        stream.Write(size);
        stream.Write(data);
        if (data.Length % 2 == 1)
        {
            stream.WriteByte(0);
        }
    }

    private static void WriteUInt24(Span<byte> destination, int value)
    {
        destination[0] = (byte)value;
        destination[1] = (byte)(value >> 8);
        destination[2] = (byte)(value >> 16);
    }

    /// <summary>
    /// A little-endian baseline TIFF, one grey deflate-compressed strip, declaring the given size; the strip holds
    /// a few compressed bytes, or is said to lie at <paramref name="stripOffset"/>.
    /// </summary>
    private static byte[] TiffDeclaring(uint width, uint height, uint? stripOffset)
    {
        var strip = PngBytes.Zlib(new byte[256]);
        const int entries = 9;
        var dataAt = 8 + 2 + (entries * 12) + 4;
        var file = new byte[dataAt + strip.Length];
        "II*\0"u8.CopyTo(file);
        BinaryPrimitives.WriteUInt32LittleEndian(file.AsSpan(4), 8);
        BinaryPrimitives.WriteUInt16LittleEndian(file.AsSpan(8), entries);
        var at = 10;
        void Entry(ushort tag, ushort type, uint value)
        {
            BinaryPrimitives.WriteUInt16LittleEndian(file.AsSpan(at), tag);
            BinaryPrimitives.WriteUInt16LittleEndian(file.AsSpan(at + 2), type);
            BinaryPrimitives.WriteUInt32LittleEndian(file.AsSpan(at + 4), 1);
            if (type == 3)
            {
                BinaryPrimitives.WriteUInt16LittleEndian(file.AsSpan(at + 8), (ushort)value);
            }
            else
            {
                BinaryPrimitives.WriteUInt32LittleEndian(file.AsSpan(at + 8), value);
            }

            at += 12;
        }

        Entry(256, 4, width);
        Entry(257, 4, height);
        Entry(258, 3, 8);
        Entry(259, 3, 8);
        Entry(262, 3, 1);
        Entry(273, 4, stripOffset ?? (uint)dataAt);
        Entry(277, 3, 1);
        Entry(278, 4, height);
        Entry(279, 4, (uint)strip.Length);
        strip.CopyTo(file, dataAt);
        return file;
    }

    /// <summary>An uncompressed grey TIFF whose one strip holds 3,000 bytes, far fewer than its declared size needs.</summary>
    private static byte[] TiffUncompressedDeclaring(uint width, uint height)
    {
        var file = TiffDeclaring(width, height, stripOffset: null);
        var directory = 10;
        BinaryPrimitives.WriteUInt16LittleEndian(file.AsSpan(directory + (3 * 12) + 8), 1); // Compression = none
        var dataAt = file.Length - PngBytes.Zlib(new byte[256]).Length;
        BinaryPrimitives.WriteUInt32LittleEndian(file.AsSpan(directory + (8 * 12) + 8), 3_000); // StripByteCounts
        return [.. file.AsSpan(0, dataAt), .. new byte[3_000]];
    }

    /// <summary>A copy of a little-endian TIFF with the RowsPerStrip (tag 278) of its first directory set to <paramref name="rows"/>.</summary>
    private static byte[] TiffWithRowsPerStrip(byte[] tiff, uint rows)
    {
        var copy = (byte[])tiff.Clone();
        var directory = (int)BinaryPrimitives.ReadUInt32LittleEndian(copy.AsSpan(4));
        var entries = BinaryPrimitives.ReadUInt16LittleEndian(copy.AsSpan(directory));
        for (var i = 0; i < entries; i++)
        {
            var entry = directory + 2 + (12 * i);
            if (BinaryPrimitives.ReadUInt16LittleEndian(copy.AsSpan(entry)) == 278)
            {
                BinaryPrimitives.WriteUInt16LittleEndian(copy.AsSpan(entry + 2), 4);
                BinaryPrimitives.WriteUInt32LittleEndian(copy.AsSpan(entry + 8), rows);
                return copy;
            }
        }

        throw new InvalidOperationException("the seed TIFF has no RowsPerStrip tag");
    }

    private static byte[] Zip()
    {
        using var stream = new MemoryStream();
        using (var zip = new ZipArchive(stream, ZipArchiveMode.Create, leaveOpen: true))
        {
            using var entry = zip.CreateEntry("photo.jpg").Open();
            entry.Write("not really a photo"u8);
        }

        return stream.ToArray();
    }
}

using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Formats.Tiff;
using SixLabors.ImageSharp.Formats.Webp;
using SixLabors.ImageSharp.Metadata.Profiles.Exif;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Imaging;

public sealed class ExifOrientationTests : IDisposable
{
    private const int Block = 16;
    private const int BlocksWide = 3;
    private const int BlocksHigh = 2;
    private readonly TestPhotos photos = new();

    /// <summary>
    /// Where stored pixel (x, y) of a w × h image appears on screen, from the orientation table of TIFF 6.0 (tag 274)
    /// and EXIF 2.3 section 4.6.4: for each value, which visual side row 0 and column 0 of the stored image lie on.
    /// Written from the table, independently of the decoder.
    /// </summary>
    private static (int X, int Y) StoredFor(int orientation, int visualX, int visualY, int w, int h) => orientation switch
    {
        2 => (w - 1 - visualX, visualY), // row 0 top, column 0 right
        3 => (w - 1 - visualX, h - 1 - visualY), // row 0 bottom, column 0 right
        4 => (visualX, h - 1 - visualY), // row 0 bottom, column 0 left
        5 => (visualY, visualX), // row 0 left, column 0 top
        6 => (visualY, h - 1 - visualX), // row 0 right, column 0 top
        7 => (w - 1 - visualY, h - 1 - visualX), // row 0 right, column 0 bottom
        8 => (w - 1 - visualY, visualX), // row 0 left, column 0 bottom
        _ => (visualX, visualY), // 1, and out-of-range values treated as 1
    };

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(6)]
    [InlineData(7)]
    [InlineData(8)]
    [InlineData(0)]
    [InlineData(9)]
    public void Decode_puts_every_stored_block_where_the_orientation_table_says(int orientation)
    {
        using var stored = BlockImage();
        var path = SaveWithOrientation(stored, orientation);

        using var photo = new PhotoDecoder().Decode(path);

        var expected = orientation is >= 1 and <= 8 ? orientation : 1;
        Assert.Equal(expected, photo.Info.Orientation);
        var (w, h) = (stored.Width, stored.Height);
        Assert.Equal(expected >= 5 ? new Size(h, w) : new Size(w, h), photo.Image.Size());
        Assert.Equal(new Size(photo.Info.Width, photo.Info.Height), photo.Image.Size());
        for (var visualY = Block / 2; visualY < photo.Image.Height; visualY += Block)
        {
            for (var visualX = Block / 2; visualX < photo.Image.Width; visualX += Block)
            {
                var (x, y) = StoredFor(expected, visualX, visualY, w, h);
                AssertClose(stored[x, y], photo.Image[visualX, visualY]);
            }
        }
    }

    [Theory]
    [InlineData("png")]
    [InlineData("webp")]
    [InlineData("jpg")]
    public void Decode_reads_the_orientation_imagesharp_writes_into_each_format(string extension)
    {
        // SixLabors.ImageSharp (a general-purpose reference encoder) writes the EXIF block: an eXIf chunk in PNG,
        // an EXIF chunk behind VP8X in WebP, an APP1 segment in JPEG. The decoder finds it in the bytes itself.
        using var stored = BlockImage();
        using var copy = stored.Clone();
        copy.Metadata.ExifProfile = new ExifProfile();
        copy.Metadata.ExifProfile.SetValue(ExifTag.Orientation, (ushort)6);
        IImageEncoder encoder = extension switch
        {
            "png" => new PngEncoder(),
            "webp" => new WebpEncoder { FileFormat = WebpFileFormatType.Lossless },
            _ => new JpegEncoder { Quality = 100 },
        };
        var path = photos.Save("turned." + extension, copy, encoder);

        using var photo = new PhotoDecoder().Decode(path);

        Assert.Equal(6, photo.Info.Orientation);
        Assert.Equal(new Size(stored.Height, stored.Width), photo.Image.Size());
        var (x, y) = StoredFor(6, Block / 2, Block / 2, stored.Width, stored.Height);
        AssertClose(stored[x, y], photo.Image[Block / 2, Block / 2]);
    }

    [Fact]
    public void Decode_reads_the_orientation_tag_of_a_tiff_directory()
    {
        // A baseline TIFF written by ImageSharp, with tag 274 (SHORT, value 8) added to its first directory by hand
        // (TIFF 6.0 section 2: entries sorted by tag; a SHORT value sits in the entry itself).
        using var stored = BlockImage();
        using var stream = new MemoryStream();
        stored.Save(stream, new TiffEncoder());
        var path = photos.Write("turned.tif", WithTiffOrientation(stream.ToArray(), 8));

        using var photo = new PhotoDecoder().Decode(path);

        Assert.Equal(8, photo.Info.Orientation);
        Assert.Equal(new Size(stored.Height, stored.Width), photo.Image.Size());
    }

    public void Dispose() => photos.Dispose();

    private static byte[] WithTiffOrientation(byte[] tiff, ushort orientation)
    {
        var directory = (int)System.Buffers.Binary.BinaryPrimitives.ReadUInt32LittleEndian(tiff.AsSpan(4));
        var entries = System.Buffers.Binary.BinaryPrimitives.ReadUInt16LittleEndian(tiff.AsSpan(directory));
        var insertAt = directory + 2;
        while (insertAt < directory + 2 + (12 * entries) && System.Buffers.Binary.BinaryPrimitives.ReadUInt16LittleEndian(tiff.AsSpan(insertAt)) < 274)
        {
            insertAt += 12;
        }

        // The new entry goes at the end of the file as a fresh directory copy, so no offset inside the file moves.
        var moved = new List<byte>(tiff);
        if (moved.Count % 2 == 1)
        {
            moved.Add(0); // directories start on a word boundary
        }

        var newDirectory = moved.Count;
        var copy = new byte[2 + (12 * (entries + 1)) + 4];
        System.Buffers.Binary.BinaryPrimitives.WriteUInt16LittleEndian(copy, (ushort)(entries + 1));
        var before = insertAt - (directory + 2);
        tiff.AsSpan(directory + 2, before).CopyTo(copy.AsSpan(2));
        var entry = copy.AsSpan(2 + before, 12);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt16LittleEndian(entry, 274);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt16LittleEndian(entry[2..], 3);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32LittleEndian(entry[4..], 1);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt16LittleEndian(entry[8..], orientation);
        tiff.AsSpan(insertAt, (12 * entries) - before).CopyTo(copy.AsSpan(2 + before + 12));
        moved.AddRange(copy);
        var result = moved.ToArray();
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32LittleEndian(result.AsSpan(4), (uint)newDirectory);
        return result;
    }

    /// <summary>3 × 2 blocks of distinct flat colours, aligned to JPEG's 16-pixel MCUs so they survive encoding.</summary>
    private static Image<Rgb24> BlockImage()
    {
        var image = new Image<Rgb24>(Block * BlocksWide, Block * BlocksHigh);
        for (var y = 0; y < image.Height; y++)
        {
            for (var x = 0; x < image.Width; x++)
            {
                var (bx, by) = (x / Block, y / Block);
                image[x, y] = new Rgb24((byte)(40 + (bx * 90)), (byte)(40 + (by * 150)), (byte)(220 - (bx * 50) - (by * 60)));
            }
        }

        return image;
    }

    private string SaveWithOrientation(Image<Rgb24> image, int orientation)
    {
        using var copy = image.Clone();
        copy.Metadata.ExifProfile = new ExifProfile();
        copy.Metadata.ExifProfile.SetValue(ExifTag.Orientation, (ushort)orientation);
        return photos.Save($"orientation-{orientation}.jpg", copy, new JpegEncoder { Quality = 100 });
    }

    private static void AssertClose(Rgb24 expected, Rgb24 actual)
    {
        var worst = Math.Max(Math.Abs(expected.R - actual.R), Math.Max(Math.Abs(expected.G - actual.G), Math.Abs(expected.B - actual.B)));
        Assert.True(worst <= 12, $"expected {expected}, got {actual}");
    }
}

using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
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

    public void Dispose() => photos.Dispose();

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

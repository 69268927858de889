using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>Tiles thumbnails of JPEG files into one PNG, for looking over a whole run at once.</summary>
internal static class ContactSheet
{
    public static void Write(IReadOnlyList<string> files, string target, int tile, int columns)
    {
        int rows = (files.Count + columns - 1) / columns;
        var sheet = new Rgb24[tile * columns * tile * rows];
        int sheetWidth = tile * columns;
        for (int i = 0; i < files.Count; i++)
        {
            using var photo = Image.Load<Rgb24>(files[i]);
            double scale = (double)tile / Math.Max(photo.Width, photo.Height);
            using var thumb = PhotoCodec.Shrink(photo, (int)(photo.Width * scale), (int)(photo.Height * scale));
            var pixels = new Rgb24[thumb.Width * thumb.Height];
            thumb.CopyPixelDataTo(pixels);
            int ox = (i % columns) * tile;
            int oy = (i / columns) * tile;
            for (int y = 0; y < thumb.Height; y++)
            {
                pixels.AsSpan(y * thumb.Width, thumb.Width).CopyTo(sheet.AsSpan(((oy + y) * sheetWidth) + ox, thumb.Width));
            }
        }

        using var image = Image.LoadPixelData<Rgb24>(sheet, sheetWidth, tile * rows);
        image.SaveAsPng(target);
    }
}

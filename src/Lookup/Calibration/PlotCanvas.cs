using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Calibration;

/// <summary>
/// A white RGB raster with the few drawing operations a histogram needs: filled and blended rectangles, horizontal
/// and vertical lines, and <see cref="BitmapFont"/> text. Everything outside the canvas is clipped.
/// Not thread-safe.
/// </summary>
internal sealed class PlotCanvas
{
    private readonly Rgb24[] _pixels;

    public PlotCanvas(int width, int height)
    {
        Width = width;
        Height = height;
        _pixels = new Rgb24[width * height];
        Array.Fill(_pixels, new Rgb24(255, 255, 255));
    }

    public int Width { get; }

    public int Height { get; }

    public Rgb24 this[int x, int y] => _pixels[(y * Width) + x];

    /// <summary>Fills the rectangle [x0, x1) × [y0, y1).</summary>
    public void Fill(int x0, int y0, int x1, int y1, Rgb24 colour) => Blend(x0, y0, x1, y1, colour, 1f);

    /// <summary>Mixes <paramref name="colour"/> into [x0, x1) × [y0, y1) with weight <paramref name="alpha"/>.</summary>
    public void Blend(int x0, int y0, int x1, int y1, Rgb24 colour, float alpha)
    {
        (x0, x1) = (Math.Max(0, Math.Min(x0, x1)), Math.Min(Width, Math.Max(x0, x1)));
        (y0, y1) = (Math.Max(0, Math.Min(y0, y1)), Math.Min(Height, Math.Max(y0, y1)));
        for (int y = y0; y < y1; y++)
        {
            var row = _pixels.AsSpan(y * Width, Width);
            for (int x = x0; x < x1; x++)
            {
                row[x] = alpha >= 1f ? colour : Mix(row[x], colour, alpha);
            }
        }
    }

    /// <summary>A horizontal line from x0 to x1 (inclusive) at y, <paramref name="thickness"/> pixels down.</summary>
    public void HorizontalLine(int x0, int x1, int y, Rgb24 colour, int thickness = 1) =>
        Fill(Math.Min(x0, x1), y, Math.Max(x0, x1) + 1, y + thickness, colour);

    /// <summary>A vertical line from y0 to y1 (inclusive) at x, <paramref name="thickness"/> pixels right.</summary>
    public void VerticalLine(int x, int y0, int y1, Rgb24 colour, int thickness = 1) =>
        Fill(x, Math.Min(y0, y1), x + thickness, Math.Max(y0, y1) + 1, colour);

    /// <summary>A vertical dashed line: <paramref name="dash"/> pixels drawn, then as many left out.</summary>
    public void DashedVerticalLine(int x, int y0, int y1, Rgb24 colour, int thickness, int dash)
    {
        for (int y = Math.Min(y0, y1); y <= Math.Max(y0, y1); y += 2 * dash)
        {
            VerticalLine(x, y, Math.Min(y + dash - 1, Math.Max(y0, y1)), colour, thickness);
        }
    }

    /// <summary>Width in pixels of <paramref name="text"/> at <paramref name="scale"/>.</summary>
    public static int TextWidth(string text, int scale) => text.Length == 0 ? 0 : ((text.Length * (BitmapFont.Width + 1)) - 1) * scale;

    /// <summary>Height in pixels of a line of text at <paramref name="scale"/>.</summary>
    public static int TextHeight(int scale) => BitmapFont.Height * scale;

    /// <summary>Draws <paramref name="text"/> with its top-left corner at (x, y), each font cell a scale × scale block.</summary>
    public void Text(int x, int y, string text, Rgb24 colour, int scale)
    {
        foreach (char c in text)
        {
            for (int gy = 0; gy < BitmapFont.Height; gy++)
            {
                for (int gx = 0; gx < BitmapFont.Width; gx++)
                {
                    if (BitmapFont.Ink(c, gx, gy))
                    {
                        Fill(x + (gx * scale), y + (gy * scale), x + ((gx + 1) * scale), y + ((gy + 1) * scale), colour);
                    }
                }
            }

            x += (BitmapFont.Width + 1) * scale;
        }
    }

    /// <summary>The canvas as PNG file bytes.</summary>
    public byte[] ToPng()
    {
        using var image = Image.LoadPixelData<Rgb24>(_pixels, Width, Height);
        using var file = new MemoryStream();
        image.SaveAsPng(file, new PngEncoder { ColorType = PngColorType.Rgb, BitDepth = PngBitDepth.Bit8 });
        return file.ToArray();
    }

    private static Rgb24 Mix(Rgb24 under, Rgb24 over, float alpha) => new(
        (byte)MathF.Round(under.R + ((over.R - under.R) * alpha)),
        (byte)MathF.Round(under.G + ((over.G - under.G) * alpha)),
        (byte)MathF.Round(under.B + ((over.B - under.B) * alpha)));
}

using Lookup.DemoGenerator.Geometry;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// Develops a linear render into 8-bit sRGB-like pixels: optional blur, exposure, soft highlight roll-off,
/// display gamma, vignette and noise. Every step is per pixel and order-free, so output is deterministic.
/// </summary>
internal static class Darkroom
{
    public static Image<Rgb24> Develop(RgbBuffer render, FilmLook look)
    {
        var buffer = render;
        for (int i = 0; i < look.BlurPasses; i++)
        {
            buffer = BlurPass(buffer);
        }

        int width = buffer.Width;
        int height = buffer.Height;
        var pixels = new Rgb24[width * height];
        Parallel.For(0, height, y =>
        {
            for (int x = 0; x < width; x++)
            {
                double cx = ((x + 0.5) / width) - 0.5;
                double cy = ((y + 0.5) / height) - 0.5;
                double vignette = 1 - (look.Vignette * 2 * ((cx * cx) + (cy * cy)));
                var c = buffer[x, y] * look.WhiteBalance * (look.Exposure * vignette);
                double noise = 0;
                if (look.NoiseLevels > 0)
                {
                    // Triangular noise from two hashed uniforms: cheap and close enough to sensor grain.
                    uint h1 = StableHash.Mix((uint)x, (uint)y, look.NoiseSeed);
                    uint h2 = StableHash.Mix((uint)y, (uint)x, look.NoiseSeed ^ 0x5bd1e995u);
                    noise = ((h1 * (1.0 / uint.MaxValue)) + (h2 * (1.0 / uint.MaxValue)) - 1) * look.NoiseLevels;
                }

                pixels[(y * width) + x] = new Rgb24(ToByte(c.X, noise), ToByte(c.Y, noise), ToByte(c.Z, noise));
            }
        });
        return Image.LoadPixelData<Rgb24>(pixels, width, height);
    }

    private static byte ToByte(double linear, double noise)
    {
        const double Knee = 0.8;
        double v = linear <= Knee ? linear : Knee + ((1 - Knee) * (linear - Knee) / ((linear - Knee) + (1 - Knee)));
        double display = (DetMath.Gamma(v) * 255) + noise;
        return (byte)Math.Clamp(Math.Round(display), 0, 255);
    }

    private static RgbBuffer BlurPass(RgbBuffer source)
    {
        int w = source.Width;
        int h = source.Height;
        var across = new RgbBuffer(w, h);
        Parallel.For(0, h, y =>
        {
            for (int x = 0; x < w; x++)
            {
                var left = source[Math.Max(x - 1, 0), y];
                var right = source[Math.Min(x + 1, w - 1), y];
                across[x, y] = (left + (source[x, y] * 2) + right) * 0.25;
            }
        });
        var down = new RgbBuffer(w, h);
        Parallel.For(0, h, y =>
        {
            for (int x = 0; x < w; x++)
            {
                var above = across[x, Math.Max(y - 1, 0)];
                var below = across[x, Math.Min(y + 1, h - 1)];
                down[x, y] = (above + (across[x, y] * 2) + below) * 0.25;
            }
        });
        return down;
    }
}

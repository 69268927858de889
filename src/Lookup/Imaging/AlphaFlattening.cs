using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Imaging;

/// <summary>
/// Composites straight (unassociated) alpha over white, the background catalogue photos are shot and shown on:
/// out = (c·a + 255·(255 − a)) / 255, rounded.
/// </summary>
internal static class AlphaFlattening
{
    public static Image<Rgb24> OverWhite(Image<Rgba32> source, Configuration configuration)
    {
        var target = new Image<Rgb24>(configuration, source.Width, source.Height);
        source.ProcessPixelRows(target, static (from, to) =>
        {
            for (var y = 0; y < from.Height; y++)
            {
                var input = from.GetRowSpan(y);
                var output = to.GetRowSpan(y);
                for (var x = 0; x < input.Length; x++)
                {
                    var p = input[x];
                    var a = p.A;
                    var white = 255 * (255 - a);
                    output[x] = new Rgb24(Blend(p.R, a, white), Blend(p.G, a, white), Blend(p.B, a, white));
                }
            }
        });
        return target;
    }

    private static byte Blend(byte colour, int alpha, int white) => (byte)(((colour * alpha) + white + 127) / 255);
}

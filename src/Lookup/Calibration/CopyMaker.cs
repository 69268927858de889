using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Calibration;

/// <summary>
/// Makes a true copy of a photo in memory: the edit, then a JPEG file's bytes, then the decoder every photo goes
/// through, so a copy reaches the network exactly as a copy file found in a catalogue would.
/// Thread-safe: no state; ImageSharp work runs on the calling thread (the decoder's configuration has one thread).
/// </summary>
internal static class CopyMaker
{
    /// <summary>Smallest side a copy may shrink to; smaller pictures carry too little to embed.</summary>
    public const int MinSide = 32;

    /// <summary>The decoded copy of <paramref name="original"/> after <paramref name="edit"/>.</summary>
    public static DecodedPhoto Make(Image<Rgb24> original, CopyEdit edit, PhotoDecoder decoder, string name)
    {
        using var edited = original.Clone(context => Apply(context, original.Width, original.Height, edit));
        using var file = new MemoryStream();
        edited.SaveAsJpeg(file, new JpegEncoder { Quality = edit.Quality });
        return decoder.Decode(file.GetBuffer().AsMemory(0, (int)file.Length), name);
    }

    /// <summary>The edit as ImageSharp operations on a <paramref name="width"/> × <paramref name="height"/> picture.</summary>
    internal static void Apply(IImageProcessingContext context, int width, int height, CopyEdit edit)
    {
        if (edit.Degrees != 0)
        {
            Straighten(context, width, height, edit.Degrees);
        }

        var crop = CropRectangle(width, height, edit);
        if (crop.Width != width || crop.Height != height)
        {
            context.Crop(crop);
        }

        if (edit.Scale != 1f)
        {
            float scale = Math.Max(edit.Scale, (float)MinSide / Math.Min(crop.Width, crop.Height));
            if (scale < 1f)
            {
                context.Resize(Math.Max(1, (int)MathF.Round(crop.Width * scale)), Math.Max(1, (int)MathF.Round(crop.Height * scale)));
            }
        }

        if (edit.Brightness != 1f)
        {
            context.Brightness(edit.Brightness);
        }

        if (edit.Contrast != 1f)
        {
            context.Contrast(edit.Contrast);
        }

        if (edit.RedGain != 1f || edit.BlueGain != 1f)
        {
            context.Filter(new ColorMatrix(edit.RedGain, 0, 0, 0, 0, 1, 0, 0, 0, 0, edit.BlueGain, 0, 0, 0, 0, 1, 0, 0, 0, 0));
        }

        if (edit.Mirror)
        {
            context.Flip(FlipMode.Horizontal);
        }
    }

    /// <summary>The kept part of a <paramref name="width"/> × <paramref name="height"/> picture.</summary>
    internal static Rectangle CropRectangle(int width, int height, CopyEdit edit)
    {
        int w = Math.Clamp((int)MathF.Round(width * edit.CropWidth), Math.Min(width, MinSide), width);
        int h = Math.Clamp((int)MathF.Round(height * edit.CropHeight), Math.Min(height, MinSide), height);
        return new Rectangle((int)MathF.Round((width - w) * edit.CropX), (int)MathF.Round((height - h) * edit.CropY), w, h);
    }

    /// <summary>
    /// Turn by θ, then cut the largest upright rectangle of the picture's shape and scale it back, as photo editors'
    /// straighten tools do: the cut is smaller by cos θ + sin θ · max(aspect, 1/aspect), so no corner shows.
    /// </summary>
    private static void Straighten(IImageProcessingContext context, int width, int height, float degrees)
    {
        context.Rotate(degrees);
        var turned = context.GetCurrentSize();
        double t = Math.Abs(degrees) * Math.PI / 180;
        double zoom = Math.Cos(t) + (Math.Sin(t) * Math.Max((double)width / height, (double)height / width));
        int w = Math.Max(1, (int)(width / zoom));
        int h = Math.Max(1, (int)(height / zoom));
        context.Crop(new Rectangle((turned.Width - w) / 2, (turned.Height - h) / 2, w, h)).Resize(width, height);
    }
}

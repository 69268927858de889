using System.Security.Cryptography;
using Lookup.Imaging;
using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Sweeps;

/// <summary>Builds sweep inputs for tests: smooth random pictures, controlled embeddings, photos from images.</summary>
internal static class SweepFixtures
{
    public const int Dimension = 64;

    /// <summary>A smooth random grey picture: a coarse random grid enlarged with bicubic interpolation.</summary>
    public static Image<Rgb24> Texture(int seed, int width = 240, int height = 180)
    {
        var random = new Random(seed);
        using var coarse = new Image<Rgb24>(12, 9);
        for (var y = 0; y < coarse.Height; y++)
        {
            for (var x = 0; x < coarse.Width; x++)
            {
                coarse[x, y] = new Rgb24((byte)random.Next(256), (byte)random.Next(256), (byte)random.Next(256));
            }
        }

        return coarse.Clone(c => c.Resize(width, height, KnownResamplers.Bicubic));
    }

    /// <summary>A random unit vector.</summary>
    public static float[] RandomUnit(Random random)
    {
        var v = new float[Dimension];
        for (var i = 0; i < v.Length; i++)
        {
            v[i] = (float)((random.NextDouble() * 2) - 1);
        }

        return Normalise(v);
    }

    /// <summary>A unit vector at exactly cosine distance <paramref name="distance"/> from unit vector <paramref name="v"/>.</summary>
    public static float[] Near(float[] v, double distance, Random random)
    {
        var w = RandomUnit(random);
        var dot = w.Zip(v, (a, b) => a * b).Sum();
        for (var i = 0; i < w.Length; i++)
        {
            w[i] -= dot * v[i];
        }

        w = Normalise(w);
        var cos = 1 - distance;
        var sin = Math.Sqrt(1 - (cos * cos));
        return [.. v.Zip(w, (a, b) => (float)((cos * a) + (sin * b)))];
    }

    public static float[] Normalise(float[] v)
    {
        var norm = (float)Math.Sqrt(v.Sum(x => x * x));
        return [.. v.Select(x => x / norm)];
    }

    /// <summary>A photo built from a picture: real thumbnail, dHash and size; SHA-256 of the given bytes.</summary>
    public static SweepPhoto Photo(int id, string sku, string path, Image<Rgb24> image, float[] embedding, byte[]? fileBytes = null)
    {
        var bytes = fileBytes ?? EncodePng(image);
        return new SweepPhoto(
            id, sku, path, Convert.ToHexStringLower(SHA256.HashData(bytes)), DHash(image), image.Width, image.Height,
            bytes.Length, embedding, Thumbnail(image), Detail(image), Chroma(image));
    }

    public static byte[] EncodePng(Image<Rgb24> image)
    {
        using var stream = new MemoryStream();
        image.SaveAsPng(stream);
        return stream.ToArray();
    }

    public static GreyThumbnail Thumbnail(Image<Rgb24> image)
    {
        using var grey = image.CloneAs<L8>();
        var bytes = new byte[image.Width * image.Height];
        grey.CopyPixelDataTo(bytes);
        return GreyThumbnail.FromGrey(bytes, image.Width, image.Height);
    }

    public static DetailThumbnail Detail(Image<Rgb24> image)
    {
        using var grey = image.CloneAs<L8>();
        var bytes = new byte[image.Width * image.Height];
        grey.CopyPixelDataTo(bytes);
        return DetailThumbnail.FromGrey(bytes, image.Width, image.Height);
    }

    public static ChromaThumbnail Chroma(Image<Rgb24> image)
    {
        var (cb, cr) = (new byte[image.Width * image.Height], new byte[image.Width * image.Height]);
        for (var y = 0; y < image.Height; y++)
        {
            for (var x = 0; x < image.Width; x++)
            {
                var p = image[x, y];
                cb[(y * image.Width) + x] = ChromaThumbnail.CbOf(p.R, p.G, p.B);
                cr[(y * image.Width) + x] = ChromaThumbnail.CrOf(p.R, p.G, p.B);
            }
        }

        return ChromaThumbnail.FromPlanes(cb, cr, image.Width, image.Height);
    }

    /// <summary>The engine's dHash (Imaging), so tests see the bit layout the index will hold.</summary>
    public static ulong DHash(Image<Rgb24> image) => DifferenceHash.Compute(image);
}

using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Imaging;

/// <summary>Builds test files in a private temporary folder that is deleted with the instance.</summary>
internal sealed class TestPhotos : IDisposable
{
    public TestPhotos()
    {
        Directory = Path.Combine(Path.GetTempPath(), "lookup-tests-" + Guid.NewGuid().ToString("N"));
        System.IO.Directory.CreateDirectory(Directory);
    }

    public string Directory { get; }

    public string Write(string name, byte[] bytes)
    {
        var path = Path.Combine(Directory, name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    public string Save(string name, Image image, IImageEncoder encoder)
    {
        var path = Path.Combine(Directory, name);
        image.Save(path, encoder);
        return path;
    }

    /// <summary>Mean absolute difference per channel value between two equally sized images.</summary>
    public static double MeanAbsoluteDifference(Image<Rgb24> a, Image<Rgb24> b)
    {
        Assert.Equal(a.Size(), b.Size());
        double total = 0;
        for (var y = 0; y < a.Height; y++)
        {
            for (var x = 0; x < a.Width; x++)
            {
                var p = a[x, y];
                var q = b[x, y];
                total += Math.Abs(p.R - q.R) + Math.Abs(p.G - q.G) + Math.Abs(p.B - q.B);
            }
        }

        return total / (3.0 * a.Width * a.Height);
    }

    public void Dispose()
    {
        try
        {
            System.IO.Directory.Delete(Directory, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}

using System.Security.Cryptography;
using Lookup.Catalogue;
using Lookup.Imaging;
using Lookup.Store;
using Lookup.Sweeps;
using Lookup.Tests.Embedding;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// One photo through the worker, checked against general-purpose references: System.Security.Cryptography for the
/// SHA-256, ImageSharp's own grey conversion and the sweep's area-average thumbnail on the full-size photo.
/// Photos: open reference photos (tests/reference-data, see SOURCES.md).
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class PhotoWorkerTests(EmbedderFixture fixture) : IDisposable
{
    private readonly IngestTree tree = new();

    [Fact]
    public void Process_fills_the_record_from_the_file_and_embeds_as_the_embedder_does()
    {
        var path = tree.Add("P-1/a.jpg", "opencv/building.jpg");
        var bytes = File.ReadAllBytes(path);
        var worker = new PhotoWorker(fixture.Decoder, fixture.Embedder, TimeProvider.System);

        var outcome = worker.Process(Job(path));

        var record = outcome.Record;
        Assert.Equal((PhotoStatus.Indexed, "P-1", "Jpeg", 868, 600), (record.Status, record.Sku, record.Format, record.Width, record.Height));
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(bytes)), record.Sha256);
        Assert.Equal(bytes.Length, record.Size);
        using var decoded = fixture.Decoder.Decode(bytes, path);
        Assert.Equal(DifferenceHash.Compute(decoded.Image), record.DHash);
        Assert.Equal(GreyThumbnail.Length, record.Thumbnail!.Length);
        var expected = fixture.EmbedBytes(bytes, path);
        Assert.All(Enumerable.Range(0, expected.Length), i => Assert.Equal(expected[i], outcome.Embedding![i], 1e-5f));
    }

    [Theory]
    [InlineData("opencv/home.jpg")]
    [InlineData("skimage/chelsea.png")]
    [InlineData("opencv/graf1.png")]
    public void Thumbnail_of_a_photo_under_twice_the_source_side_is_the_area_average_of_the_whole_photo(string reference)
    {
        using var image = Image.Load<Rgb24>(IngestTree.Reference(reference));

        Assert.Equal(FullSize(image), PhotoWorker.Thumbnail(image));
    }

    [Theory]
    [InlineData("opencv/aloeL.jpg", 1.0)]
    [InlineData("opencv/graf1.png", 2.0)]
    [InlineData("skimage/coffee.png", 4243 / 600.0)]
    [InlineData("opencv/baboon.jpg", 1732 / 512.0)]
    public void Thumbnail_of_a_large_photo_is_taken_from_block_means_within_rounding_of_the_full_size_one(string reference, double enlarge)
    {
        using var image = Image.Load<Rgb24>(IngestTree.Reference(reference));
        image.Mutate(x => x.Resize((int)(image.Width * enlarge), (int)(image.Height * enlarge)));

        var fast = PhotoWorker.Thumbnail(image);
        var exact = FullSize(image);

        // Measured: at most 10 grey levels apart (graf1 enlarged 2×: fine detail on a bin edge), 0.05–1.06 on average,
        // correlation ≥ 0.9992; the sweep calls thumbnails copies from a correlation of 0.95–0.97.
        var differences = fast.Zip(exact, (a, b) => Math.Abs(a - b)).ToArray();
        Assert.True(differences.Max() <= 12, $"largest difference {differences.Max()} grey levels");
        Assert.True(differences.Average() <= 1.5, $"mean difference {differences.Average():0.000} grey levels");
        Assert.True(Ncc(fast, exact) >= 0.999, $"correlation {Ncc(fast, exact):0.00000}");
    }

    [Theory]
    [InlineData(4000, 100)]
    [InlineData(100, 4000)]
    [InlineData(3000, 20)]
    public void Thumbnail_of_a_long_thin_photo_keeps_at_least_32_samples_across(int width, int height)
    {
        using var image = new Image<Rgb24>(width, height);
        image.ProcessPixelRows(rows =>
        {
            for (int y = 0; y < rows.Height; y++)
            {
                var row = rows.GetRowSpan(y);
                for (int x = 0; x < row.Length; x++)
                {
                    byte v = (byte)((x * 7 + y * 13) % 256);
                    row[x] = new Rgb24(v, v, v);
                }
            }
        });

        var differences = PhotoWorker.Thumbnail(image).Zip(FullSize(image), (a, b) => Math.Abs(a - b)).ToArray();

        // Measured on this sawtooth, the worst case for moved bin edges: at most 7 grey levels, 2.2 on average.
        Assert.True(differences.Max() <= 10, $"largest difference {differences.Max()} grey levels");
        Assert.True(differences.Average() <= 3, $"mean difference {differences.Average():0.000} grey levels");
    }

    public void Dispose() => tree.Dispose();

    /// <summary>Normalised cross-correlation, as the sweep compares thumbnails.</summary>
    private static double Ncc(byte[] a, byte[] b)
    {
        double ma = a.Average(v => (double)v), mb = b.Average(v => (double)v);
        double ab = 0, aa = 0, bb = 0;
        for (int i = 0; i < a.Length; i++)
        {
            ab += (a[i] - ma) * (b[i] - mb);
            aa += (a[i] - ma) * (a[i] - ma);
            bb += (b[i] - mb) * (b[i] - mb);
        }

        return ab / Math.Sqrt(aa * bb);
    }

    /// <summary>The sweep's thumbnail of the full-size photo through ImageSharp's grey conversion: the reference.</summary>
    private static byte[] FullSize(Image<Rgb24> image)
    {
        using var grey = image.CloneAs<L8>();
        var pixels = new byte[image.Width * image.Height];
        grey.CopyPixelDataTo(pixels);
        return GreyThumbnail.FromGrey(pixels, image.Width, image.Height).Pixels.ToArray();
    }

    private PhotoJob Job(string path)
    {
        var info = new FileInfo(path);
        var entry = new CatalogueEntry(path, Path.GetRelativePath(tree.Root, path).Replace('\\', '/'), info.Length, info.LastWriteTimeUtc.Ticks, ImageFormat.Jpeg, null);
        return new PhotoJob(new MappedEntry(entry, "P-1"), null, null);
    }
}

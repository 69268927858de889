using Lookup.Sweeps;
using Lookup.Tests.Datasets;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using Xunit.Abstractions;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// Different items of one Fashion-MNIST class (the first 700 test images, committed under tests/reference-data; see
/// <see cref="FashionMnist"/>) play the part of look-alike products shot the same way: one outline on a plain
/// background, which is what misled the 32 × 32 thumbnails. Every same-class pair is classified as if its embeddings
/// were 0.05 apart (inside the crop band), so only pixel evidence decides.
/// </summary>
public sealed class LookAlikeOutlineTests(ITestOutputHelper output)
{
    private const int Items = 700;

    [Fact]
    public void Different_items_of_one_class_are_at_most_one_copy_in_ten_thousand_pairs()
    {
        var images = FashionMnist.ReadImages(ReferencePaths.FashionMnist("t10k-first2000-images-idx3-ubyte.gz"), Items);
        var labels = FashionMnist.ReadLabels(ReferencePaths.FashionMnist("t10k-first2000-labels-idx1-ubyte.gz"), Items);
        var photos = images.Select((pixels, i) => Photo(i, pixels)).ToArray();
        var withDetail = new PairClassifier(new SweepOptions());
        var (pairs, falseCopies, coarseOnly) = (0, 0, 0);
        for (var i = 0; i < photos.Length; i++)
        {
            for (var j = i + 1; j < photos.Length; j++)
            {
                if (labels[i] != labels[j] || images[i].AsSpan().SequenceEqual(images[j]))
                {
                    continue;
                }

                pairs++;
                var (relation, evidence) = withDetail.Classify(photos[i], photos[i].Thumbnail, photos[j], photos[j].Thumbnail, 0.05f);
                falseCopies += relation >= PairRelation.Copy ? 1 : 0;
                coarseOnly += evidence.DetailCorrelation is not null ? 1 : 0;
            }
        }

        output.WriteLine($"{pairs} same-class pairs of different items: {coarseOnly} pass the 32 × 32 bar " +
            $"({100.0 * coarseOnly / pairs:0.00} %), {falseCopies} remain copies after the detail and colour checks " +
            $"({10000.0 * falseCopies / pairs:0.00} in 10,000)");
        Assert.True(falseCopies * 10000L <= pairs, $"{falseCopies} false copies in {pairs} pairs is more than 1 in 10,000.");
    }

    private static SweepPhoto Photo(int id, byte[] pixels)
    {
        using var image = new Image<Rgb24>(FashionMnist.Side, FashionMnist.Side);
        for (var y = 0; y < FashionMnist.Side; y++)
        {
            for (var x = 0; x < FashionMnist.Side; x++)
            {
                var v = pixels[(y * FashionMnist.Side) + x];
                image[x, y] = new Rgb24(v, v, v);
            }
        }

        return SweepFixtures.Photo(id, "A", $"fashion-mnist/{id}.png", image, [1f]);
    }
}

using Lookup.Imaging;
using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Sweeps;

public sealed class DHashBitsTests
{
    [Fact]
    public void Mirror_gives_the_hash_of_the_mirrored_grid_when_no_neighbours_are_equal()
    {
        var random = new Random(7);
        for (var trial = 0; trial < 50; trial++)
        {
            // Distinct values in every row, so no comparison ties.
            var grid = Enumerable.Range(0, 8).Select(_ => Enumerable.Range(0, 9).Select(_ => random.NextDouble()).ToArray()).ToArray();
            var mirrored = grid.Select(row => row.Reverse().ToArray()).ToArray();
            Assert.Equal(HashOf(mirrored), DHashBits.Mirror(HashOf(grid)));
        }
    }

    [Theory]
    [InlineData("opencv/baboon.jpg")]
    [InlineData("opencv/fruits.jpg")]
    [InlineData("skimage/astronaut.png")]
    [InlineData("skimage/coffee.png")]
    public void Mirror_matches_the_imaging_dhash_of_the_mirrored_photo(string photo)
    {
        // Reference photos (tests/reference-data, see SOURCES.md) with texture everywhere, so neighbours rarely tie;
        // a tie or a resampling difference may still flip a bit or two.
        using var image = Image.Load<Rgb24>(ReferencePhotos.PathOf(photo));
        using var mirrored = image.Clone(c => c.Flip(FlipMode.Horizontal));

        var derived = DHashBits.Mirror(DifferenceHash.Compute(image));

        Assert.InRange(DHashBits.Distance(derived, DifferenceHash.Compute(mirrored)), 0, 2);
    }

    [Fact]
    public void Mirror_twice_is_the_identity()
    {
        var random = new Random(11);
        for (var i = 0; i < 100; i++)
        {
            var hash = (ulong)random.NextInt64() ^ ((ulong)random.Next() << 40);
            Assert.Equal(hash, DHashBits.Mirror(DHashBits.Mirror(hash)));
        }
    }

    [Theory]
    [InlineData(0UL, 0UL, 0)]
    [InlineData(0UL, ulong.MaxValue, 64)]
    [InlineData(0b1011UL, 0b0001UL, 2)]
    public void Distance_counts_differing_bits(ulong a, ulong b, int expected) => Assert.Equal(expected, DHashBits.Distance(a, b));

    private static ulong HashOf(double[][] grid)
    {
        var hash = 0UL;
        foreach (var row in grid)
        {
            for (var x = 0; x < 8; x++)
            {
                hash = (hash << 1) | (row[x + 1] > row[x] ? 1UL : 0UL);
            }
        }

        return hash;
    }
}

using Lookup.Matching;
using SixLabors.ImageSharp;

namespace Lookup.Tests.Matching;

public sealed class QueryCropsTests
{
    [Theory]
    [InlineData(CropSet.None, 1)]
    [InlineData(CropSet.Standard, 6)]
    [InlineData(CropSet.Dense, 15)]
    public void For_gives_the_whole_photo_first_and_as_many_regions_as_Count(CropSet set, int count)
    {
        var regions = QueryCrops.For(640, 480, set);

        Assert.Equal(count, regions.Length);
        Assert.Equal(count, QueryCrops.Count(set));
        Assert.Equal(new Rectangle(0, 0, 640, 480), regions[0]);
    }

    [Theory]
    [InlineData(640, 480)]
    [InlineData(480, 640)]
    [InlineData(4032, 3024)]
    [InlineData(300, 300)]
    [InlineData(1000, 97)]
    public void Every_region_is_a_square_inside_the_photo_except_the_whole_photo(int width, int height)
    {
        var bounds = new Rectangle(0, 0, width, height);
        var regions = QueryCrops.For(width, height, CropSet.Dense);

        Assert.All(regions.Skip(1), r =>
        {
            Assert.True(bounds.Contains(r), $"{r} is outside {bounds}");
            Assert.Equal(r.Width, r.Height);
        });
    }

    [Fact]
    public void Standard_crops_are_the_centre_and_the_four_corners_at_0_7_of_the_short_side()
    {
        var regions = QueryCrops.For(640, 480, CropSet.Standard);

        Assert.Equal(
            [new(152, 72, 336, 336), new(0, 0, 336, 336), new(304, 0, 336, 336), new(0, 144, 336, 336), new(304, 144, 336, 336)],
            regions.Skip(1));
    }

    [Fact]
    public void Dense_grid_spreads_3_by_3_squares_of_0_45_of_the_short_side_from_edge_to_edge()
    {
        var grid = QueryCrops.For(640, 480, CropSet.Dense).Skip(6).ToArray();

        Assert.All(grid, r => Assert.Equal(216, r.Width));
        Assert.Equal([0, 212, 424], grid.Take(3).Select(r => r.X));
        Assert.Equal([0, 132, 264], grid.Where((_, i) => i % 3 == 0).Select(r => r.Y));
    }

    [Fact]
    public void A_photo_too_small_to_crop_is_searched_whole_only()
    {
        Assert.Single(QueryCrops.For(5, 40, CropSet.Dense));
    }
}

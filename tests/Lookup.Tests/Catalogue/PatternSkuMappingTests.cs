using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class PatternSkuMappingTests
{
    [Fact]
    public void Map_takes_the_sku_group_from_the_relative_path()
    {
        var mapping = SkuMapping.Parse(@"pattern:(?<sku>[A-Z]{3}-\d+)_\d+\.jpg$", "/");

        var result = mapping.Map([FolderSkuMappingTests.Entry("BRK-100_1.jpg"), FolderSkuMappingTests.Entry("shelf/HSE-7_2.jpg")]);

        Assert.Equal(["BRK-100", "HSE-7"], result.Photos.Select(p => p.Sku));
        Assert.Empty(result.Problems);
    }

    [Fact]
    public void Map_can_use_folder_names_because_it_sees_the_whole_relative_path()
    {
        var mapping = SkuMapping.Parse("pattern:^(?<sku>[^/]+)/", "/");

        var result = mapping.Map([FolderSkuMappingTests.Entry("V-22/sub/p.jpg")]);

        Assert.Equal("V-22", Assert.Single(result.Photos).Sku);
    }

    [Fact]
    public void Map_reports_a_photo_that_does_not_match_and_never_guesses()
    {
        var mapping = SkuMapping.Parse(@"pattern:^(?<sku>[A-Z]{3}-\d+)_", "/");

        var result = mapping.Map([FolderSkuMappingTests.Entry("brk-100_1.jpg"), FolderSkuMappingTests.Entry("BRK-9_1.jpg")]);

        Assert.Equal([null, "BRK-9"], result.Photos.Select(p => p.Sku));
        var problem = Assert.Single(result.Problems);
        Assert.Equal((MappingProblemKind.Unmapped, "/cat/brk-100_1.jpg"), (problem.Kind, problem.Path));
        Assert.Contains("'brk-100_1.jpg' does not match the pattern", problem.Message);
    }

    [Fact]
    public void Map_reports_a_match_whose_sku_group_is_empty()
    {
        var mapping = SkuMapping.Parse(@"pattern:^(?<sku>[A-Z]*)_", "/");

        var result = mapping.Map([FolderSkuMappingTests.Entry("_1.jpg")]);

        Assert.Null(Assert.Single(result.Photos).Sku);
        Assert.Contains("its sku group is empty", Assert.Single(result.Problems).Message);
    }
}

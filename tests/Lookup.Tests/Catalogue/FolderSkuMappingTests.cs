using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class FolderSkuMappingTests
{
    [Fact]
    public void Map_takes_the_name_of_the_folder_that_directly_holds_the_photo()
    {
        CatalogueEntry[] entries = [Entry("BRK-100/front.jpg"), Entry("hoses/HS-2/side.png"), Entry("a/b/c/d.jpg")];

        var result = new FolderSkuMapping().Map(entries);

        Assert.Equal(["BRK-100", "HS-2", "c"], result.Photos.Select(p => p.Sku));
        Assert.Empty(result.Problems);
        Assert.False(result.HasErrors);
    }

    [Fact]
    public void Map_leaves_a_photo_in_the_root_unmapped_with_an_error()
    {
        var result = new FolderSkuMapping().Map([Entry("loose.jpg"), Entry("S1/p.jpg")]);

        Assert.Equal([null, "S1"], result.Photos.Select(p => p.Sku));
        Assert.Equal(["S1/p.jpg"], result.Mapped.Select(p => p.Entry.RelativePath));
        var problem = Assert.Single(result.Problems);
        Assert.Equal((MappingProblemKind.Unmapped, ProblemSeverity.Error, "/cat/loose.jpg"), (problem.Kind, problem.Severity, problem.Path));
        Assert.Contains("move it into a folder named after its SKU", problem.Message);
        Assert.True(result.HasErrors);
    }

    internal static CatalogueEntry Entry(string relativePath) =>
        new("/cat/" + relativePath, relativePath, 10, 1, ImageFormat.Jpeg, null);
}

using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class SkuMappingTests : IDisposable
{
    private readonly TempTree _tree = new();

    public void Dispose() => _tree.Dispose();

    [Theory]
    [InlineData("folder")]
    [InlineData("FOLDER")]
    [InlineData(" folder ")]
    public void Parse_reads_folder_in_any_case(string spec)
    {
        Assert.IsType<FolderSkuMapping>(SkuMapping.Parse(spec, _tree.Root));
    }

    [Fact]
    public void Parse_reads_a_csv_path_relative_to_the_base_folder()
    {
        _tree.Text("tables/skus.csv", "file,sku\n");

        var mapping = SkuMapping.Parse("csv:tables/skus.csv", _tree.Root);

        Assert.IsType<CsvSkuMapping>(mapping);
        Assert.Equal("csv:" + _tree.PathOf("tables/skus.csv"), mapping.Spec);
    }

    [Fact]
    public void Parse_keeps_colons_inside_a_pattern()
    {
        var mapping = SkuMapping.Parse("pattern:^(?<sku>[A-Z]+:\\d+)_", _tree.Root);

        Assert.Equal("pattern:^(?<sku>[A-Z]+:\\d+)_", mapping.Spec);
    }

    [Theory]
    [InlineData("", "the SKU mapping is empty")]
    [InlineData("   ", "the SKU mapping is empty")]
    [InlineData("folders", "'folders' is not a SKU mapping; use folder, csv:FILE or pattern:REGEX")]
    [InlineData("folder:x", "folder takes no argument")]
    [InlineData("csv:", "csv: needs the path of a table")]
    [InlineData("csv:missing.csv", "missing.csv does not exist")]
    [InlineData("pattern:", "pattern: needs a regular expression")]
    [InlineData("pattern:(unclosed", "is not a valid .NET regular expression")]
    [InlineData("pattern:^([A-Z]+)_", "has no group named sku")]
    public void TryParse_explains_what_is_wrong_with_a_bad_spec(string spec, string expected)
    {
        Assert.False(SkuMapping.TryParse(spec, _tree.Root, out var mapping, out var error));
        Assert.Null(mapping);
        Assert.Contains(expected, error);
        Assert.Contains(expected, Assert.Throws<SkuMappingException>(() => SkuMapping.Parse(spec, _tree.Root)).Message);
    }
}

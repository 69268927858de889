using System.Text;
using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class CsvSkuMappingTests : IDisposable
{
    private readonly TempTree _tree = new();

    public CsvSkuMappingTests()
    {
        _tree.File("photos/BRK-1/a.jpg", SampleImages.Jpeg(10));
        _tree.File("photos/BRK-1/b.jpg", SampleImages.Jpeg(20));
        _tree.File("photos/x/c.jpg", SampleImages.Jpeg(30));
        _tree.File("photos/loose.png", SampleImages.Png());
        _tree.Text("photos/notes.txt", "not a photo");
    }

    public void Dispose() => _tree.Dispose();

    [Fact]
    public void Map_gives_several_photos_one_sku_from_relative_and_absolute_quoted_paths()
    {
        var result = Map(
            "file,sku\r\n"
            + "photos/BRK-1/a.jpg,BRK-1\r\n"
            + "photos/BRK-1/b.jpg,BRK-1\r\n"
            + $"\"{_tree.PathOf("photos/x/c.jpg")}\",\"HS,\"\"2\"\"\"\r\n"
            + "photos/loose.png,  LP-9  \r\n");

        Assert.Equal(
            [("BRK-1/a.jpg", "BRK-1"), ("BRK-1/b.jpg", "BRK-1"), ("loose.png", "LP-9"), ("x/c.jpg", "HS,\"2\"")],
            result.Photos.Select(p => (p.Entry.RelativePath, p.Sku)));
        Assert.Empty(result.Problems);
    }

    [Fact]
    public void Map_reads_backslashes_in_a_file_cell_as_folder_separators()
    {
        var result = Map("file,sku\r\nphotos\\BRK-1\\b.jpg,BRK-1\r\n");

        Assert.Equal("BRK-1", result.Photos.Single(p => p.Entry.RelativePath == "BRK-1/b.jpg").Sku);
        Assert.DoesNotContain(result.Problems, p => p.Kind == MappingProblemKind.RowFileMissing);
    }

    [Fact]
    public void Map_reports_every_kind_of_bad_row_with_its_line_in_line_order()
    {
        var result = Map(
            "file,sku\n"                                      // line 1
            + "photos/BRK-1/a.jpg,BRK-1\n"                    // line 2
            + "photos/x/c.jpg,HS-2\n"                         // line 3
            + "photos/missing.jpg,ZZ-1\n"                     // line 4: file does not exist
            + "photos/BRK-1/a.jpg,BRK-1\n"                    // line 5: duplicate, same SKU
            + "photos/loose.png,\n"                           // line 6: empty SKU
            + $"{_tree.PathOf("photos/x/c.jpg")},HS-3\n"      // line 7: same file as line 3, other SKU
            + "photos/notes.txt,N-1\n"                        // line 8: exists, but not a scanned photo
            + "bad\"row,1\n"                                  // line 9: quote in an unquoted field
            + "a,b,c\n");                                     // line 10: three fields

        Assert.Equal(
            [
                (MappingProblemKind.RowFileMissing, ProblemSeverity.Error, (int?)4),
                (MappingProblemKind.DuplicateRow, ProblemSeverity.Warning, 5),
                (MappingProblemKind.EmptySku, ProblemSeverity.Error, 6),
                (MappingProblemKind.ConflictingSku, ProblemSeverity.Error, 7),
                (MappingProblemKind.RowFileNotScanned, ProblemSeverity.Warning, 8),
                (MappingProblemKind.MalformedRow, ProblemSeverity.Error, 9),
                (MappingProblemKind.MalformedRow, ProblemSeverity.Error, 10),
                (MappingProblemKind.Unmapped, ProblemSeverity.Error, null),
            ],
            result.Problems.Select(p => (p.Kind, p.Severity, p.Line)));
        // Conflicting and empty SKUs leave the photo unmapped without a second, vaguer problem.
        Assert.Equal(
            [("BRK-1/a.jpg", "BRK-1"), ("BRK-1/b.jpg", null), ("loose.png", null), ("x/c.jpg", null)],
            result.Photos.Select(p => (p.Entry.RelativePath, p.Sku)));
        Assert.Equal(_tree.PathOf("photos/BRK-1/b.jpg"), result.Problems[^1].Path);
    }

    [Fact]
    public void Map_names_both_skus_and_both_lines_of_a_conflict()
    {
        var result = Map("file,sku\nphotos/x/c.jpg,HS-2\nphotos/x/../x/c.jpg,HS-3\n");

        var conflict = Assert.Single(result.Problems, p => p.Kind == MappingProblemKind.ConflictingSku);
        Assert.Contains("SKU HS-3 here but SKU HS-2 on line 2", conflict.Message);
        Assert.Contains("line 3", conflict.Message);
        Assert.Equal(_tree.PathOf("photos/x/c.jpg"), conflict.Path);
    }

    [Fact]
    public void Map_explains_a_missing_file_with_the_path_it_looked_for()
    {
        var result = Map("file,sku\nphotos/missing.jpg,ZZ-1\n");

        var missing = Assert.Single(result.Problems, p => p.Kind == MappingProblemKind.RowFileMissing);
        Assert.Contains("looked for " + _tree.PathOf("photos/missing.jpg"), missing.Message);
        Assert.Contains("skus.csv line 2", missing.Message);
    }

    [Fact]
    public void Map_reads_a_header_in_any_order_with_extra_columns_a_byte_order_mark_and_crlf()
    {
        var bytes = Encoding.UTF8.GetPreamble().Concat(Encoding.UTF8.GetBytes(
            "SKU,Description,File\r\nBRK-1,\"Pad, front\",photos/BRK-1/a.jpg\r\n")).ToArray();
        _tree.File("skus.csv", bytes);

        var result = SkuMapping.Parse("csv:skus.csv", _tree.Root).Map(Scan());

        Assert.Equal("BRK-1", result.Photos.Single(p => p.Entry.RelativePath == "BRK-1/a.jpg").Sku);
        Assert.DoesNotContain(result.Problems, p => p.Kind != MappingProblemKind.Unmapped);
    }

    [Theory]
    [InlineData("photo,code\na.jpg,X\n", "line 1: the header must name the columns file and sku (found: photo,code)")]
    [InlineData("a.jpg,X\n", "line 1: the header must name the columns file and sku")]
    [InlineData("\n\n", "is empty")]
    [InlineData("", "is empty")]
    public void Map_refuses_a_table_without_a_usable_header(string text, string expected)
    {
        _tree.Text("skus.csv", text);
        var mapping = SkuMapping.Parse("csv:skus.csv", _tree.Root);

        var error = Assert.Throws<SkuMappingException>(() => mapping.Map(Scan()));

        Assert.Contains(expected, error.Message);
        Assert.Contains(_tree.PathOf("skus.csv"), error.Message);
    }

    private SkuMappingResult Map(string csv)
    {
        _tree.Text("skus.csv", csv);
        return SkuMapping.Parse("csv:" + _tree.PathOf("skus.csv"), "/elsewhere").Map(Scan());
    }

    private IReadOnlyList<CatalogueEntry> Scan() => new CatalogueScanner().Scan(_tree.PathOf("photos")).Entries;
}

using Lookup.Cli.Output;

namespace Lookup.Tests.Cli.Output;

public sealed class TextTableTests
{
    [Fact]
    public void Columns_are_padded_to_the_widest_cell_and_numbers_align_right()
    {
        var table = new TextTable("rank", "SKU", "distance").AlignRight(0, 2);
        table.Add(1, "HB-M8", 0.01234f);
        table.Add(10, "WASHER-LONG", 0.5f);

        string[] lines = table.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries);

        Assert.Equal("rank  SKU          distance", lines[0]);
        Assert.Equal("   1  HB-M8          0.0123", lines[2]);
        Assert.Equal("  10  WASHER-LONG    0.5000", lines[3]);
    }

    [Fact]
    public void A_row_with_the_wrong_number_of_cells_is_refused()
    {
        var table = new TextTable("a", "b");
        Assert.Throws<ArgumentException>(() => table.Add("only one"));
    }
}

using Lookup.Reports;

namespace Lookup.Tests.Reports;

public sealed class CsvCellTests
{
    // The characters OWASP's "CSV Injection" page lists as formula triggers: = + - @ tab carriage-return.
    [Theory]
    [InlineData("=1+2", "'=1+2")]
    [InlineData("+49 30 1234", "'+49 30 1234")]
    [InlineData("-A12", "'-A12")]
    [InlineData("@SUM(A1:A9)", "'@SUM(A1:A9)")]
    [InlineData("\tindent", "'\tindent")]
    [InlineData("\r=cmd", "'\r=cmd")]
    [InlineData("BRK-1", "BRK-1")]
    [InlineData(" =spaced", " =spaced")]
    [InlineData("", "")]
    public void Neutralise_prefixes_a_quote_to_values_a_spreadsheet_would_run(string value, string expected)
    {
        Assert.Equal(expected, CsvCell.Neutralise(value));
    }

    [Theory]
    [InlineData("plain", "plain")]
    [InlineData("a,b", "\"a,b\"")]
    [InlineData("say \"hi\"", "\"say \"\"hi\"\"\"")]
    [InlineData("line\nbreak", "\"line\nbreak\"")]
    [InlineData("cr\rhere", "\"cr\rhere\"")]
    [InlineData("Ölfilter Ø12 日本", "Ölfilter Ø12 日本")]
    [InlineData("<script>alert(1)</script>", "<script>alert(1)</script>")]
    public void Quote_encloses_only_values_that_rfc_4180_says_need_it(string value, string expected)
    {
        Assert.Equal(expected, CsvCell.Quote(value));
    }

    [Fact]
    public void Text_neutralises_before_quoting_so_a_hyperlink_formula_stays_text()
    {
        Assert.Equal("\"'=HYPERLINK(\"\"http://example.invalid\"\",\"\"open\"\")\"",
            CsvCell.Text("=HYPERLINK(\"http://example.invalid\",\"open\")"));
        Assert.Equal("", CsvCell.Text(null));
    }
}

using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class CsvRecordReaderTests
{
    // The worked examples of RFC 4180, section 2 (rules 1 to 7), each with the fields the RFC says they hold.
    [Theory]
    [InlineData("aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n", "aaa|bbb|ccc;zzz|yyy|xxx")] // Rules 1 and 2.
    [InlineData("aaa,bbb,ccc\r\nzzz,yyy,xxx", "aaa|bbb|ccc;zzz|yyy|xxx")] // Rule 2: last line break optional.
    [InlineData("\"aaa\",\"bbb\",\"ccc\"\r\nzzz,yyy,xxx", "aaa|bbb|ccc;zzz|yyy|xxx")] // Rule 5.
    [InlineData("\"aaa\",\"b\r\nbb\",\"ccc\"\r\nzzz,yyy,xxx", "aaa|b\r\nbb|ccc;zzz|yyy|xxx")] // Rule 6.
    [InlineData("\"aaa\",\"b\"\"bb\",\"ccc\"", "aaa|b\"bb|ccc")] // Rule 7.
    [InlineData("a,,c\n,\n", "a||c;|")] // Empty fields, LF line ends.
    [InlineData("a,b\n\n\r\nc,d\n", "a|b;c|d")] // Blank lines are skipped.
    public void Read_splits_the_rfc_4180_examples_into_their_fields(string text, string expected)
    {
        var records = CsvRecordReader.Read(text);

        Assert.Equal(expected, string.Join(";", records.Select(r => string.Join("|", r.Fields))));
        Assert.All(records, r => Assert.Null(r.Error));
    }

    [Fact]
    public void Read_numbers_records_by_the_line_they_start_on_across_quoted_line_breaks()
    {
        var records = CsvRecordReader.Read("h1,h2\r\n\"multi\r\nline\nfield\",x\r\n\r\nlast,y\r\n");

        Assert.Equal([1, 2, 6], records.Select(r => r.Line));
    }

    [Fact]
    public void Read_reports_a_quote_inside_an_unquoted_field_and_resumes_on_the_next_line()
    {
        var records = CsvRecordReader.Read("a,b\nphoto.jpg,AB\"C\nnext.jpg,D\n");

        Assert.Equal(3, records.Count);
        Assert.Contains("field 2 has a quote inside unquoted text", records[1].Error);
        Assert.Equal(2, records[1].Line);
        Assert.Equal(["next.jpg", "D"], records[2].Fields);
        Assert.Null(records[2].Error);
    }

    [Fact]
    public void Read_reports_text_after_a_closing_quote()
    {
        var records = CsvRecordReader.Read("\"a\"b,c\nd,e\n");

        Assert.Contains("text follows the closing quote", records[0].Error);
        Assert.Equal(["d", "e"], records[1].Fields);
    }

    [Fact]
    public void Read_reports_a_quoted_field_that_is_never_closed_with_the_line_it_opened_on()
    {
        var records = CsvRecordReader.Read("a,b\nc,d\ne,\"never closed\nmore\n");

        Assert.Equal(3, records.Count);
        Assert.Equal(3, records[2].Line);
        Assert.Contains("opened on line 3 is never closed", records[2].Error);
    }
}

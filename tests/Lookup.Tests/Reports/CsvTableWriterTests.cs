using Lookup.Catalogue;
using Lookup.Reports;
using Microsoft.VisualBasic.FileIO;

namespace Lookup.Tests.Reports;

public sealed class CsvTableWriterTests
{
    [Fact]
    public void Writer_separates_with_commas_and_ends_records_with_crlf()
    {
        var text = new StringWriter();
        var csv = new CsvTableWriter(text);

        csv.Row("path", "sku", "distance");
        csv.Text("a.jpg").Text(null).Number(-0.25).EndRow();
        csv.Number(42L).EndRow();

        // Numbers we write are not neutralised: -0.25 stays a number.
        Assert.Equal("path,sku,distance\r\na.jpg,,-0.25\r\n42\r\n", text.ToString());
    }

    [Fact]
    public void Writer_writes_an_empty_cell_for_a_number_that_is_not_finite()
    {
        var text = new StringWriter();
        new CsvTableWriter(text).Number(double.NaN).Number(1.5).EndRow();

        Assert.Equal(",1.5\r\n", text.ToString());
    }

    [Fact]
    public void Writer_output_reads_back_through_an_independent_csv_parser()
    {
        string[][] rows =
        [
            ["file", "sku", "note"],
            ["<script>alert(\"x\")</script>.jpg", "BRK,1", "say \"hi\""],
            ["Bremsbeläge Ø12/日本.png", "=2+3", "two\r\nlines"],
            ["@cmd", "-1", "\ttabbed"],
        ];
        var text = new StringWriter();
        var csv = new CsvTableWriter(text);
        foreach (var row in rows)
        {
            csv.Row(row);
        }

        // Microsoft.VisualBasic.FileIO.TextFieldParser ships with .NET and is the reference reader here.
        using var parser = new TextFieldParser(new StringReader(text.ToString()))
        {
            HasFieldsEnclosedInQuotes = true,
            TrimWhiteSpace = false,
        };
        parser.SetDelimiters(",");
        var parsed = new List<string[]>();
        while (!parser.EndOfData)
        {
            parsed.Add(parser.ReadFields()!);
        }

        var expected = rows.Select(r => r.Select(CsvCell.Neutralise).ToArray()).ToList();
        Assert.Equal(expected, parsed);
        Assert.Equal(expected, CsvRecordReader.Read(text.ToString()).Select(r => r.Fields.ToArray()));
        Assert.Equal("'=2+3", parsed[2][1]);
        Assert.Equal("'-1", parsed[3][1]);
    }
}

using System.Text;
using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class SweepCsvWriterTests
{
    [Fact]
    public void Write_neutralises_every_text_cell_a_spreadsheet_would_run_as_a_formula()
    {
        var rows = Rows(HostileCatalogue.Report());

        // OWASP "CSV Injection": a cell starting with = + - @ (or tab, CR) is a formula to a spreadsheet (common practice).
        Assert.All(rows.SelectMany(r => r), cell => Assert.False(
            cell.Length > 0 && "=+-@\t\r".Contains(cell[0], StringComparison.Ordinal), $"cell {cell}"));
        Assert.Contains(rows.SelectMany(r => r), cell => cell == "'" + HostileCatalogue.Skus["A"]);
        Assert.Contains(rows.SelectMany(r => r), cell => cell == "'" + HostileCatalogue.Skus["E"]);
    }

    [Fact]
    public void Write_has_a_header_and_one_row_per_photo_per_finding_with_sixteen_cells()
    {
        var report = HostileCatalogue.Report();

        var rows = Rows(report);

        Assert.Equal("finding", rows[0][0]);
        Assert.Equal(1 + report.Findings.Sum(f => f.Members.Count), rows.Count);
        Assert.All(rows, r => Assert.Equal(16, r.Count));
        Assert.Contains(rows, r => r[4] == HostileCatalogue.Skus["F"]);
    }

    private static List<List<string>> Rows(SweepReport report)
    {
        using var writer = new StringWriter();
        SweepCsvWriter.Write(report, writer);
        return Parse(writer.ToString());
    }

    /// <summary>An RFC 4180 reader (quoted fields, doubled quotes, CRLF records), independent of the writer.</summary>
    private static List<List<string>> Parse(string text)
    {
        var rows = new List<List<string>>();
        var row = new List<string>();
        var cell = new StringBuilder();
        var quoted = false;
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < text.Length && text[i + 1] == '"')
                {
                    cell.Append('"');
                    i++;
                }
                else if (c == '"')
                {
                    quoted = false;
                }
                else
                {
                    cell.Append(c);
                }
            }
            else if (c == '"')
            {
                quoted = true;
            }
            else if (c == ',')
            {
                row.Add(cell.ToString());
                cell.Clear();
            }
            else if (c == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
            {
                row.Add(cell.ToString());
                cell.Clear();
                rows.Add(row);
                row = [];
                i++;
            }
            else
            {
                cell.Append(c);
            }
        }

        return rows;
    }
}

using System.Text.RegularExpressions;
using Lookup.Catalogue;
using Lookup.Tests.Catalogue;
using static Lookup.Tests.Sweeps.IngestedCatalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// File and folder names chosen to break careless output, through the real commands end to end: ingest, sweep
/// (HTML report and CSV) and match (CSV). The same reference photo (opencv-doc apple.jpg, tests/reference-data)
/// is filed under every hostile SKU, so the sweep reports one finding naming them all. CSV cells that start with
/// = + - @ tab or carriage return must carry a leading single quote (OWASP "CSV Injection", common practice);
/// HTML must show every name as text; paths are relative to the catalogue root.
/// </summary>
public sealed partial class OutputSafetyTests : IDisposable
{
    private static readonly string[] Hostile =
    [
        "=SUM(1+1)/<script>alert(1).jpg",
        "+49 & \"Co\"/-2+3 'x'.jpg",
        "@cmd/\rCR <b>bold.jpg",
        "\tTAB/=HYPERLINK(\"x\").jpg",
        "-minus/<img src=x onerror=alert(2)>.jpg",
    ];

    private readonly IngestTree tree = new();

    [Fact]
    public void Every_name_is_text_in_the_html_report_neutralised_in_both_csv_files_and_relative_to_the_root()
    {
        foreach (var path in Hostile)
        {
            tree.Add(path, "opencv/apple.jpg");
        }

        for (var i = 0; i < 3; i++)
        {
            tree.Add($"GOOD-{i}/{i}.jpg", IngestTree.Distinct[i + 9]);
        }

        var html = tree.Outside("sweep.html");
        var sweepCsv = tree.Outside("sweep.csv");
        Assert.Equal(1, RunCommand("ingest", tree.Root, "--index", tree.IndexPath, "--quiet").ExitCode == 0 ? 1 : 0);
        var sweep = RunCommand("sweep", "--index", tree.IndexPath, "--report", html, "--csv", sweepCsv, "--no-store", "--quiet");
        var match = RunCommand("match", tree.PathOf(Hostile[0]), "--index", tree.IndexPath, "--csv", "--top", "5", "--crops", "none");

        Assert.True(sweep.ExitCode == 3, sweep.Error);
        Assert.True(match.ExitCode == 0, match.Error);
        var page = File.ReadAllText(html);
        AssertHtmlShowsNamesAsText(page);
        var sweepCells = Cells(File.ReadAllText(sweepCsv));
        var matchCells = Cells(match.Output);
        foreach (var cells in new[] { sweepCells, matchCells })
        {
            AssertNeutralised(cells);
        }

        foreach (var path in Hostile)
        {
            var sku = path[..path.IndexOf('/', StringComparison.Ordinal)];
            Assert.Contains("'" + sku, sweepCells);
            Assert.Contains("'" + path, sweepCells);
            Assert.Contains("'" + sku, matchCells);
        }

        // Relative paths: the root appears once in the page, in the line that says paths are relative to it, and
        // in no CSV cell except the match query, which is the path as the user gave it.
        Assert.Single(Regex.Matches(page, Regex.Escape(tree.Root)));
        Assert.Contains($"paths are relative to the catalogue root {tree.Root}", page, StringComparison.Ordinal);
        Assert.DoesNotContain(sweepCells, c => c.Contains(tree.Root, StringComparison.Ordinal));
        Assert.All(matchCells.Where(c => c.Contains(tree.Root, StringComparison.Ordinal)), c => Assert.Equal(tree.PathOf(Hostile[0]), c));
    }

    public void Dispose() => tree.Dispose();

    private static void AssertHtmlShowsNamesAsText(string page)
    {
        Assert.Single(ScriptTag().Matches(page));
        Assert.DoesNotContain("<script>alert", page, StringComparison.Ordinal);
        Assert.DoesNotContain("<img src=x", page, StringComparison.Ordinal);
        Assert.DoesNotContain("<b>bold", page, StringComparison.Ordinal);
        Assert.Contains("=SUM(1+1)/&lt;script&gt;alert(1).jpg", page, StringComparison.Ordinal);
        Assert.Contains("+49 &amp; &quot;Co&quot;/-2+3 &#39;x&#39;.jpg", page, StringComparison.Ordinal);
        Assert.Contains("-minus/&lt;img src=x onerror=alert(2)&gt;.jpg", page, StringComparison.Ordinal);
        Assert.Contains("SKU @cmd", page, StringComparison.Ordinal);

        Assert.Contains("SKU \tTAB", page, StringComparison.Ordinal);

        // Every attribute value is quoted and holds no raw quote, angle bracket or ampersand other than references.
        foreach (Match attribute in Attribute().Matches(page))
        {
            var value = attribute.Groups[1].Value;
            Assert.DoesNotContain('<', value);
            Assert.DoesNotContain('"', value);
            Assert.True(Regex.IsMatch(value, "&(?!(amp|lt|gt|quot|#39);)") is false, value);
        }
    }

    private static void AssertNeutralised(List<string> cells)
    {
        Assert.NotEmpty(cells);
        Assert.All(cells, c => Assert.False(c.Length > 0 && c[0] is '=' or '+' or '-' or '@' or '\t' or '\r', $"cell {c} could start a formula"));
    }

    private static List<string> Cells(string csv)
    {
        var records = CsvRecordReader.Read(csv);
        Assert.All(records, r => Assert.Null(r.Error));
        Assert.True(records.Count > 1, csv);
        return [.. records.SelectMany(r => r.Fields)];
    }

    [GeneratedRegex("<script[ >]")]
    private static partial Regex ScriptTag();

    [GeneratedRegex("=\"([^\"]*)\"")]
    private static partial Regex Attribute();
}

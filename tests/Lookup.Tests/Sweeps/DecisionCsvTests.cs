using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

/// <summary>Reading reviewers' decisions from CSV (RFC 4180) with <see cref="DecisionCsv"/>.</summary>
public sealed class DecisionCsvTests
{
    private const string KeyA = "0123456789abcdef0123456789abcdef";
    private const string KeyB = "fedcba9876543210fedcba9876543210";

    [Fact]
    public void Parse_reads_a_sweep_csv_once_per_finding_with_its_note()
    {
        var csv = "finding,kind,finding_key,role,sku,path,note\r\n" +
            $"1,copies,{KeyA},member,S,S/a.jpg,\"same photo, kept twice on purpose\"\r\n" +
            $"1,copies,{KeyA},member,S,S/b.jpg,\r\n" +
            $"2,look-alikes,{KeyB},member,T,T/c.jpg,\r\n";

        var (requests, problems, skipped) = DecisionCsv.Parse(csv, "reviewed.csv");

        Assert.Empty(problems);
        Assert.Equal(0, skipped);
        Assert.Equal(
            [DismissRequest.ForKey(KeyA, "same photo, kept twice on purpose", null, "reviewed.csv line 2"), DismissRequest.ForKey(KeyB, "", null, "reviewed.csv line 4")],
            requests);
    }

    [Fact]
    public void Parse_takes_only_rows_marked_not_duplicate_when_there_is_a_decision_column()
    {
        var csv = "key,decision,reviewer\n" +
            $"{KeyA},Not-Duplicate,ana\n" +
            $"{KeyB},,\n" +
            "aaaaaaaa,duplicate,\n" +
            "bbbbbbbb, dismiss ,\n";

        var (requests, problems, skipped) = DecisionCsv.Parse(csv, "d.csv");

        Assert.Empty(problems);
        Assert.Equal(2, skipped);
        Assert.Equal([(KeyA, "ana"), ("bbbbbbbb", (string?)null)], requests.Select(r => (r.Key, r.Reviewer)));
    }

    [Fact]
    public void Parse_reads_pairs_of_paths_and_undoes_the_formula_guard_of_our_csv_writer()
    {
        var csv = "\uFEFFFirst_Path,Second_Path,Note\r\n'-D/x.png,'=E/y.png,mirror pair\r\n\"A/with, comma.jpg\",B/b.jpg,\r\n";

        var (requests, problems, _) = DecisionCsv.Parse(csv, "pairs.csv");

        Assert.Empty(problems);
        Assert.Equal(
            [DismissRequest.ForPair("-D/x.png", "=E/y.png", "mirror pair", null, "pairs.csv line 2"), DismissRequest.ForPair("A/with, comma.jpg", "B/b.jpg", "", null, "pairs.csv line 3")],
            requests);
    }

    [Theory]
    [InlineData("", "t.csv is empty")]
    [InlineData("path,sku\r\nA/a.jpg,A\r\n", "t.csv line 1: the header names neither finding_key (or key) nor first_path and second_path")]
    [InlineData("first_path,second_path\r\nA/a.jpg,\r\n", "t.csv line 2: neither a key nor two photo paths")]
    [InlineData("key\r\n\"abc\"def\r\n", "t.csv line 2: ")]
    public void Parse_reports_each_problem_with_file_and_line(string csv, string expected)
    {
        var (requests, problems, _) = DecisionCsv.Parse(csv, "t.csv");

        Assert.Empty(requests);
        Assert.StartsWith(expected, Assert.Single(problems), StringComparison.Ordinal);
    }
}

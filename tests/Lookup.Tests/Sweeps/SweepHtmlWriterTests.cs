using System.Text.RegularExpressions;
using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Sweeps;

public sealed partial class SweepHtmlWriterTests
{
    private static readonly string Page = Render(HostileCatalogue.Report());

    [Fact]
    public void Write_escapes_every_name_so_none_becomes_markup()
    {
        Assert.DoesNotContain("<script>alert", Page, StringComparison.Ordinal);
        Assert.DoesNotContain("<img src=x", Page, StringComparison.Ordinal);
        Assert.Contains("&lt;script&gt;alert(&#39;b&#39;)&lt;/script&gt;", Page, StringComparison.Ordinal);
        Assert.Contains("+C &amp; &quot;quoted&quot;", Page, StringComparison.Ordinal);
        Assert.Single(ScriptTags().Matches(Page));
    }

    [Fact]
    public void Write_keeps_non_ascii_names_as_they_are()
    {
        Assert.Contains(HostileCatalogue.Skus["F"], Page, StringComparison.Ordinal);
        Assert.StartsWith("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">", Page, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_makes_a_page_that_needs_no_network_and_no_other_file()
    {
        var sources = SourceAttributes().Matches(Page).Select(m => m.Groups[1].Value).ToList();

        Assert.NotEmpty(sources);
        Assert.All(sources, s => Assert.StartsWith("data:image/jpeg;base64,", s, StringComparison.Ordinal));
        Assert.DoesNotContain("href=", Page, StringComparison.Ordinal);
        Assert.DoesNotContain("<link", Page, StringComparison.Ordinal);
        Assert.Contains("default-src 'none'", Page, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_shows_every_finding_with_its_kind_for_the_filter_and_its_verdict()
    {
        var report = HostileCatalogue.Report();

        Assert.Equal(report.Findings.Count, FindingSections().Matches(Page).Count);
        foreach (var kind in Enum.GetValues<FindingKind>())
        {
            Assert.Contains($"data-kind=\"{FindingKindText.Code(kind)}\"", Page, StringComparison.Ordinal);
        }

        Assert.Contains(Lookup.Reports.HtmlText.Escape(Verdicts.SafetyNotice), Page, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_without_previews_shows_placeholders()
    {
        using var writer = new StringWriter();
        SweepHtmlWriter.Write(HostileCatalogue.Report(), writer);

        Assert.DoesNotContain("<img", writer.ToString(), StringComparison.Ordinal);
        Assert.Contains("no preview", writer.ToString(), StringComparison.Ordinal);
    }

    private static string Render(SweepReport report)
    {
        using var tiny = new Image<Rgb24>(8, 8);
        using var jpeg = new MemoryStream();
        tiny.SaveAsJpeg(jpeg);
        var bytes = jpeg.ToArray();
        using var writer = new StringWriter();
        SweepHtmlWriter.Write(report, writer, _ => bytes);
        return writer.ToString();
    }

    [GeneratedRegex("<script[ >]")]
    private static partial Regex ScriptTags();

    [GeneratedRegex("src=\"([^\"]*)\"")]
    private static partial Regex SourceAttributes();

    [GeneratedRegex("<section class=\"finding\"")]
    private static partial Regex FindingSections();
}

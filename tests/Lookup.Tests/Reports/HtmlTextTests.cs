using System.Net;
using Lookup.Reports;

namespace Lookup.Tests.Reports;

public sealed class HtmlTextTests
{
    [Fact]
    public void Escape_turns_a_script_tag_in_a_file_name_into_plain_text()
    {
        var escaped = HtmlText.Escape("<script>alert(\"x\")</script>.jpg");

        Assert.Equal("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;.jpg", escaped);
    }

    [Theory]
    [InlineData("<script>alert(1)</script>")]
    [InlineData("O'Brien & Sons \"best\" <b>")]
    [InlineData("\" onmouseover=\"alert(1)")]
    [InlineData("' onerror='alert(1)")]
    [InlineData("Ölfilter Ø12 – 日本語 😀")]
    [InlineData("tab\there\nand a new line")]
    [InlineData("&amp; already escaped")]
    public void Escape_leaves_no_markup_or_quote_and_decodes_back_with_the_framework_decoder(string name)
    {
        var escaped = HtmlText.Escape(name);

        Assert.DoesNotContain('<', escaped);
        Assert.DoesNotContain('>', escaped);
        Assert.DoesNotContain('"', escaped);
        Assert.DoesNotContain('\'', escaped);
        // System.Net.WebUtility is the reference decoder: what a browser shows is the original name.
        Assert.Equal(name, WebUtility.HtmlDecode(escaped));
    }

    [Fact]
    public void Escape_keeps_non_ascii_characters_as_they_are()
    {
        Assert.Equal("Bremsbeläge Ø 12 mm – 日本 😀", HtmlText.Escape("Bremsbeläge Ø 12 mm – 日本 😀"));
    }

    [Theory]
    [InlineData("a\u0001b", "a\uFFFDb")]
    [InlineData("a\u0000b", "a\uFFFDb")]
    [InlineData("a\u007Fb\u0085c", "a\uFFFDb\uFFFDc")]
    public void Escape_replaces_characters_html_forbids(string text, string expected)
    {
        Assert.Equal(expected, HtmlText.Escape(text));
    }

    [Fact]
    public void Escape_replaces_unpaired_surrogates_and_keeps_pairs()
    {
        // Built in code: attribute arguments cannot carry an unpaired surrogate through metadata.
        var high = new string([(char)0xD800]);
        var low = new string([(char)0xDC00]);
        var pair = char.ConvertFromUtf32(0x1F600);

        Assert.Equal("a\uFFFDb", HtmlText.Escape("a" + high + "b"));
        Assert.Equal("a\uFFFDb", HtmlText.Escape("a" + low + "b"));
        Assert.Equal("end\uFFFD", HtmlText.Escape("end" + pair[0]));
        Assert.Equal("\uFFFD" + pair, HtmlText.Escape(pair[1] + pair));
    }

    [Fact]
    public void Escape_of_null_or_empty_is_empty()
    {
        Assert.Equal("", HtmlText.Escape(null));
        Assert.Equal("", HtmlText.Escape(""));
    }

    [Theory]
    [InlineData("BRK-1/front view.jpg", "BRK-1/front%20view.jpg")]
    [InlineData("javascript:alert(1)", "javascript%3Aalert%281%29")]
    [InlineData("a#b?c/\"q\".jpg", "a%23b%3Fc/%22q%22.jpg")]
    [InlineData("Ø/ö.png", "%C3%98/%C3%B6.png")] // UTF-8 then percent-encoding: RFC 3986, section 2.5.
    public void UrlPath_percent_encodes_each_segment_so_a_name_cannot_become_a_scheme(string path, string expected)
    {
        var url = HtmlText.UrlPath(path);

        Assert.Equal(expected, url);
        Assert.DoesNotContain(':', url);
        Assert.False(Uri.TryCreate(url, UriKind.Absolute, out var absolute) && absolute.Scheme != Uri.UriSchemeFile);
        Assert.Equal(path, string.Join('/', url.Split('/').Select(Uri.UnescapeDataString)));
    }
}

using System.Diagnostics;
using System.Text.RegularExpressions;
using Lookup.Sweeps;
using Lookup.Tests.Sweeps;
using static Lookup.Tests.Sweeps.IngestedCatalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// The HTML report of the real <c>lookup sweep</c>, opened in headless Chromium (Debian package <c>chromium</c>,
/// installed for CI by <c>.ci/run</c> through tools/install-test-deps.sh): the page a reviewer sees is parsed by a real
/// browser, not by our own reading of our own output.
/// </summary>
[Collection(IngestedCatalogueCollection.Name)]
public sealed partial class SweepReportBrowserTests(IngestedCatalogue catalogue) : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("lookup-report-").FullName;

    [Fact]
    public void Html_report_renders_every_finding_with_previews_and_shows_hostile_names_as_text()
    {
        var report = Path.Combine(_folder, "sweep.html");
        var (exitCode, _, error) = RunCommand("sweep", "--index", catalogue.Index, "--no-store", "--quiet", "--report", report);
        Assert.True(exitCode == 3, error);
        var (_, json, _) = RunCommand("sweep", "--index", catalogue.Index, "--no-store", "--quiet", "--json");
        var findings = SweepJson.Parse(json).Findings;

        var dom = DumpDom(report);

        // One rendered group per finding, in report order, each with its kind.
        var sections = SectionKind().Matches(dom).Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(findings.Select(f => FindingKindText.Code(Enum.Parse<FindingKind>(f.Kind, ignoreCase: true))), sections);

        // Hostile SKU and file name are text: escaped in the serialised DOM, never elements; the only script is ours.
        // (Attribute values, such as an image's alt text, are blanked before counting elements: the serialiser leaves
        // '<' unescaped inside them.)
        Assert.Contains("&lt;script&gt;alert('x')&lt;script&gt; \"quoted\" Ölfilter Ø12 日本.png", dom, StringComparison.Ordinal);
        Assert.Contains("SKU &lt;img src=x onerror=alert(2)&gt; &amp; \"SKU\" 'Ø12'", dom, StringComparison.Ordinal);
        var elements = AttributeValue().Replace(dom, "=\"\"");
        Assert.Single(ScriptTag().Matches(elements));
        Assert.Equal(ImageTag().Matches(dom).Count, Regex.Matches(elements, "<img ").Count);
        Assert.All(ImageTag().Matches(dom), m => Assert.StartsWith("data:image/jpeg;base64,", m.Groups[1].Value, StringComparison.Ordinal));

        // Every photo of the tree exists, so every figure has its preview; the safety notice opens and closes the page.
        Assert.Equal(findings.Sum(f => f.Members.Count), ImageTag().Matches(dom).Count);
        Assert.DoesNotContain("no preview", dom, StringComparison.Ordinal);
        Assert.Equal(2, Regex.Matches(dom, Regex.Escape(Lookup.Reports.HtmlText.Escape(Verdicts.SafetyNotice))).Count);

        // The index was never calibrated: the page says its bands are defaults and how to calibrate.
        Assert.Contains("This index has not been calibrated: the sweep used its default bands", dom, StringComparison.Ordinal);
        Assert.Contains("<code>lookup calibrate --index FILE</code>", dom, StringComparison.Ordinal);
    }

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    /// <summary>The page's DOM after Chromium has parsed it and run its script.</summary>
    private string DumpDom(string page)
    {
        var chromium = new[] { "/usr/bin/chromium", "/usr/bin/chromium-browser" }.FirstOrDefault(File.Exists)
            ?? throw new InvalidOperationException(
                "Chromium is not installed, and this test needs a real browser to check the HTML report: install it with " +
                "tools/install-test-deps.sh chromium (CI does this through .ci/run).");
        var start = new ProcessStartInfo(chromium)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var argument in new[]
        {
            "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update",
            "--disable-sync", "--no-first-run", $"--user-data-dir={Path.Combine(_folder, "profile")}", "--dump-dom", page,
        })
        {
            start.ArgumentList.Add(argument);
        }

        using var process = Process.Start(start)!;
        var error = process.StandardError.ReadToEndAsync();
        var output = process.StandardOutput.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(2)))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"Chromium did not finish rendering {page} within 2 minutes.");
        }

        Assert.True(process.ExitCode == 0, $"Chromium exited with {process.ExitCode}: {error.Result}");
        return output.Result;
    }

    [GeneratedRegex("<section class=\"finding\" data-kind=\"([a-z-]+)\"")]
    private static partial Regex SectionKind();

    [GeneratedRegex("<script[ >]")]
    private static partial Regex ScriptTag();

    [GeneratedRegex("=\"[^\"]*\"")]
    private static partial Regex AttributeValue();

    [GeneratedRegex("<img src=\"([^\"]*)\"")]
    private static partial Regex ImageTag();
}

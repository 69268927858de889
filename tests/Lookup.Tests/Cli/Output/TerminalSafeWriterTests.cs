using System.Diagnostics;
using Lookup.Cli.Output;
using Lookup.Tests.Catalogue;

namespace Lookup.Tests.Cli.Output;

public sealed class TerminalSafeWriterTests
{
    [Fact]
    public void Write_replaces_escape_and_the_other_control_sequence_starters_and_keeps_the_rest()
    {
        // ESC ] 0 ; … BEL sets a terminal's title; U+009B is the 8-bit CSI (ECMA-48 section 5.3).
        using var inner = new StringWriter();
        using var writer = new TerminalSafeWriter(inner);

        writer.Write("a\u001B]0;owned\u0007b\u009B2Jc\u007F");
        writer.Write('\u001B');
        writer.WriteLine("\ttab\rcr 日本 😀 Ø12");

        Assert.Equal("a\uFFFD]0;owned\uFFFDb\uFFFD2Jc\uFFFD\uFFFD\ttab\rcr 日本 😀 Ø12" + inner.NewLine, inner.ToString());
    }

    [Fact]
    public void A_name_with_an_escape_sequence_reaches_a_real_terminal_as_plain_text()
    {
        // script(1) (util-linux) runs the real command on a pseudo-terminal, so the command sees a terminal.
        if (!OperatingSystem.IsLinux() || !File.Exists("/usr/bin/script"))
        {
            return;
        }

        using var tree = new IngestTree();
        var path = tree.Write("notes\u001B]0;owned\u0007.jpg", "not a photo"u8.ToArray());
        var host = Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } h && File.Exists(h) ? h : "dotnet";
        var cli = Path.Combine(AppContext.BaseDirectory, "Lookup.Cli.dll");
        var info = new ProcessStartInfo("/usr/bin/script")
        {
            ArgumentList = { "-qec", $"'{host}' '{cli}' inspect '{path}'", "/dev/null" },
            RedirectStandardOutput = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };

        using var script = Process.Start(info)!;
        var output = script.StandardOutput.ReadToEnd();
        script.WaitForExit();

        Assert.Contains("notes\uFFFD]0;owned\uFFFD.jpg: not a JPEG", output, StringComparison.Ordinal);
        // The .NET console sends its own set-up sequences (ESC [ ? 1 h); the name's must not be among them.
        Assert.DoesNotContain("\u001B]0;owned", output, StringComparison.Ordinal);
        Assert.DoesNotContain('\u0007', output);
    }
}

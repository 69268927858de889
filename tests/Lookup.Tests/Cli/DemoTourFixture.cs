using System.Text.Json;
using Lookup.Tests.Demo;

namespace Lookup.Tests.Cli;

/// <summary>
/// One run of the real <c>lookup demo --json</c> on the committed demo-catalogue (a temporary index, the report in a
/// temporary folder), shared by the tour's tests: the tour indexes 137 photos, so it runs once.
/// </summary>
public sealed class DemoTourFixture : IDisposable
{
    public DemoTourFixture()
    {
        Folder = Path.Combine(Path.GetTempPath(), "lookup-demo-test-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Folder);
        Report = Path.Combine(Folder, "tour.html");
        var started = DateTime.UtcNow;
        (ExitCode, Output, Error) = MatchIndexFixture.Run("demo", "--catalogue", DemoFolder.Root, "--report", Report, "--json", "--quiet");
        WallTime = DateTime.UtcNow - started;
        Json = ExitCode == 0 ? JsonDocument.Parse(Output) : JsonDocument.Parse("{}");
    }

    public string Folder { get; }

    public string Report { get; }

    public int ExitCode { get; }

    public string Output { get; }

    public string Error { get; }

    public TimeSpan WallTime { get; }

    public JsonDocument Json { get; }

    public JsonElement Root => Json.RootElement;

    public void Dispose()
    {
        Json.Dispose();
        try
        {
            Directory.Delete(Folder, recursive: true);
        }
        catch (IOException)
        {
            // Left for the system's temp cleaning.
        }
    }
}

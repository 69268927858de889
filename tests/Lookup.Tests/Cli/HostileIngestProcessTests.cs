using System.Text.Json;
using Xunit.Abstractions;
using Lookup.Store;
using Lookup.Tests.Catalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// The real <c>lookup ingest</c> in a child process over the hostile corpus (<see cref="Imaging.HostilePhotos"/>)
/// mixed with good reference photos (tests/reference-data, see SOURCES.md): every file accounted for in the JSON
/// summary and the index, and the process's peak memory bounded.
/// </summary>
public sealed class HostileIngestProcessTests(ITestOutputHelper log) : IDisposable
{
    /// <summary>
    /// What the hostile files may add to the peak resident set of a run over the good photos alone. Refused files
    /// cost their bytes (the largest is 32 MiB of EXIF segments) and a header read; had any bomb been decoded it
    /// would have needed at least 400 MB (a 20,000 × 20,000 frame at one byte a pixel) and most need gigabytes
    /// (40,000² RGBA is 6.4 GB). Two workers may each hold one file's bytes at once.
    /// </summary>
    private const long ExtraBytesAllowed = 200L << 20;

    /// <summary>
    /// An absolute ceiling: the runtime, ONNX Runtime and ResNet18 (11.7 M weights, about 47 MB) came to 352 MiB
    /// for the good photos alone on the development machine; 1 GiB leaves room for another allocator or runtime
    /// version, and a decoded bomb exceeds it.
    /// </summary>
    private const long CeilingBytes = 1L << 30;

    private readonly IngestTree good = new();
    private readonly IngestTree hostile = new();

    [Fact]
    public void Ingest_records_every_hostile_file_indexes_every_good_photo_and_its_peak_memory_stays_bounded()
    {
        HostileTree.Fill(good, hostile: false);
        var expected = HostileTree.Fill(hostile);

        var (goodExit, _, goodPeak) = Ingest(good);
        var (exitCode, output, peak) = Ingest(hostile);

        Assert.Equal(0, goodExit);
        Assert.Equal(1, exitCode);
        using var json = JsonDocument.Parse(output);
        var failures = json.RootElement.GetProperty("failures").EnumerateArray()
            .ToDictionary(f => f.GetProperty("path").GetString()!, f => f.GetProperty("reason").GetString(), StringComparer.Ordinal);
        Assert.Equal(expected.Where(e => e.Value is not null).OrderBy(e => e.Key, StringComparer.Ordinal),
            failures.OrderBy(e => e.Key, StringComparer.Ordinal));
        Assert.Equal(expected.Count(e => e.Value is null), json.RootElement.GetProperty("indexedTotal").GetInt32());
        var index = IndexSnapshot.Read(hostile.IndexPath);
        Assert.All(expected.Where(e => e.Value is null), e => Assert.Equal(PhotoStatus.Indexed, index.Records[e.Key].Status));

        var message = $"peak resident set {peak >> 20} MiB with the hostile files, {goodPeak >> 20} MiB without";
        log.WriteLine(message);
        Assert.True(peak > 0 && goodPeak > 0, message);
        Assert.True(peak <= goodPeak + ExtraBytesAllowed, message);
        Assert.True(peak <= CeilingBytes, message);
    }

    public void Dispose()
    {
        good.Dispose();
        hostile.Dispose();
    }

    private static (int ExitCode, string Output, long Peak) Ingest(IngestTree tree)
    {
        var seconds = HostileTree.DecodeLimit.TotalSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture);
        using var child = LookupProcess.Start(
            ["ingest", tree.Root, "--index", tree.IndexPath, "--workers", "2", "--max-decode-seconds", seconds, "--json", "--quiet"]);
        var (exitCode, peak) = PeakMemory.WaitForExit(child);
        Assert.True(exitCode is 0 or 1, $"exit code {exitCode}: {child.Error}");
        return (exitCode, child.Output, peak);
    }
}

using System.Runtime.Versioning;
using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

/// <summary>Unreadable, vanishing and failing paths become problems, never exceptions out of the scan.</summary>
public sealed class CatalogueScannerFaultTests : IDisposable
{
    private readonly TempTree _tree = new();

    public void Dispose() => _tree.Dispose();

    [Fact]
    [UnsupportedOSPlatform("windows")]
    public void Scan_reports_a_file_without_read_permission_or_reads_it_when_the_process_bypasses_permissions()
    {
        var path = _tree.File("sku/locked.png", SampleImages.Png());
        _tree.File("sku/open.png", SampleImages.Png());
        File.SetUnixFileMode(path, UnixFileMode.None);
        // Root (CAP_DAC_OVERRIDE) reads a mode-000 file anyway; the injected-fault test below covers that case.
        var readable = CanOpen(path);

        var scan = new CatalogueScanner().Scan(_tree.Root);

        if (readable)
        {
            Assert.Equal(["sku/locked.png", "sku/open.png"], scan.Entries.Select(e => e.RelativePath));
            Assert.Empty(scan.Problems);
        }
        else
        {
            Assert.Equal(["sku/open.png"], scan.Entries.Select(e => e.RelativePath));
            var problem = Assert.Single(scan.Problems);
            Assert.Equal((ScanProblemKind.AccessDenied, "sku/locked.png"), (problem.Kind, problem.RelativePath));
            Assert.Equal(["sku/locked.png"], scan.Unreadable);
        }
    }

    [Fact]
    [UnsupportedOSPlatform("windows")]
    public void Scan_reports_a_folder_without_read_permission_or_reads_it_when_the_process_bypasses_permissions()
    {
        _tree.File("locked/p.png", SampleImages.Png());
        _tree.File("open/q.png", SampleImages.Png());
        File.SetUnixFileMode(_tree.PathOf("locked"), UnixFileMode.None);
        var readable = CanList(_tree.PathOf("locked"));

        var scan = new CatalogueScanner().Scan(_tree.Root);

        if (readable)
        {
            Assert.Equal(["locked/p.png", "open/q.png"], scan.Entries.Select(e => e.RelativePath));
            Assert.Empty(scan.Problems);
        }
        else
        {
            Assert.Equal(["open/q.png"], scan.Entries.Select(e => e.RelativePath));
            Assert.Equal([(ScanProblemKind.AccessDenied, "locked")], scan.Problems.Select(p => (p.Kind, p.RelativePath)));
            Assert.Equal(["locked"], scan.Unreadable);
        }
    }

    [Fact]
    public void Scan_turns_access_denied_on_a_file_into_a_problem_that_hides_its_content()
    {
        _tree.File("sku/locked.png", SampleImages.Png());
        _tree.File("sku/open.png", SampleImages.Png());
        var io = ScanIo.Default with
        {
            OpenRead = p => p.EndsWith("locked.png", StringComparison.Ordinal)
                ? throw new UnauthorizedAccessException("Access to the path is denied.")
                : ScanIo.Default.OpenRead(p),
        };

        var scan = new CatalogueScanner(ScanOptions.Default, io).Scan(_tree.Root);

        Assert.Equal(["sku/open.png"], scan.Entries.Select(e => e.RelativePath));
        var problem = Assert.Single(scan.Problems);
        Assert.Equal((ScanProblemKind.AccessDenied, "sku/locked.png"), (problem.Kind, problem.RelativePath));
        Assert.Contains(_tree.PathOf("sku/locked.png"), problem.Message);
        Assert.Contains("permission denied", problem.Message);
        Assert.Equal(["sku/locked.png"], scan.Unreadable);
    }

    [Fact]
    public void Scan_turns_access_denied_and_io_errors_on_folders_into_problems()
    {
        _tree.File("denied/p.png", SampleImages.Png());
        _tree.File("failing/p.png", SampleImages.Png());
        _tree.File("fine/p.png", SampleImages.Png());
        var io = ScanIo.Default with
        {
            List = p => Path.GetFileName(p) switch
            {
                "denied" => throw new UnauthorizedAccessException("Access to the path is denied."),
                "failing" => throw new IOException("Input/output error"),
                _ => ScanIo.Default.List(p),
            },
        };

        var scan = new CatalogueScanner(ScanOptions.Default, io).Scan(_tree.Root);

        Assert.Equal(["fine/p.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal(
            [(ScanProblemKind.AccessDenied, "denied"), (ScanProblemKind.ReadError, "failing")],
            scan.Problems.Select(p => (p.Kind, p.RelativePath)));
        Assert.Contains("Input/output error", scan.Problems[1].Message);
        Assert.Equal(["denied", "failing"], scan.Unreadable);
    }

    [Fact]
    public void Scan_reports_a_file_that_vanishes_between_listing_and_reading()
    {
        _tree.File("sku/a.png", SampleImages.Png());
        _tree.File("sku/b.png", SampleImages.Png());
        var io = ScanIo.Default with
        {
            OpenRead = p =>
            {
                if (p.EndsWith("a.png", StringComparison.Ordinal))
                {
                    File.Delete(p);
                }

                return ScanIo.Default.OpenRead(p);
            },
        };

        var scan = new CatalogueScanner(ScanOptions.Default, io).Scan(_tree.Root);

        Assert.Equal(["sku/b.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal([(ScanProblemKind.Vanished, "sku/a.png")], scan.Problems.Select(p => (p.Kind, p.RelativePath)));
        Assert.Empty(scan.Unreadable);
    }

    [Fact]
    public void Scan_reports_a_folder_that_vanishes_after_its_parent_was_listed()
    {
        _tree.File("a.png", SampleImages.Png());
        _tree.File("b/p.png", SampleImages.Png());
        var io = ScanIo.Default with
        {
            OpenRead = p =>
            {
                if (p.EndsWith("a.png", StringComparison.Ordinal))
                {
                    Directory.Delete(_tree.PathOf("b"), recursive: true);
                }

                return ScanIo.Default.OpenRead(p);
            },
        };

        var scan = new CatalogueScanner(ScanOptions.Default, io).Scan(_tree.Root);

        Assert.Equal(["a.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal([(ScanProblemKind.Vanished, "b")], scan.Problems.Select(p => (p.Kind, p.RelativePath)));
    }

    [Fact]
    public void Scan_stops_with_cancellation_when_asked()
    {
        _tree.File("sku/p.png", SampleImages.Png());
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();

        Assert.Throws<OperationCanceledException>(() => new CatalogueScanner().Scan(_tree.Root, cancelled.Token));
    }

    private static bool CanOpen(string path)
    {
        try
        {
            using var stream = File.OpenRead(path);
            return true;
        }
        catch (UnauthorizedAccessException)
        {
            return false;
        }
    }

    private static bool CanList(string path)
    {
        try
        {
            _ = Directory.EnumerateFileSystemEntries(path).ToList();
            return true;
        }
        catch (UnauthorizedAccessException)
        {
            return false;
        }
    }
}

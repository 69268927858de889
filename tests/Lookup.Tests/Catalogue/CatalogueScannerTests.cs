using System.Diagnostics;
using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class CatalogueScannerTests : IDisposable
{
    private readonly TempTree _tree = new();

    public void Dispose() => _tree.Dispose();

    [Fact]
    public void Scan_lists_images_with_relative_paths_sizes_and_times_in_ordinal_order()
    {
        var png = SampleImages.Png();
        var jpeg = SampleImages.Jpeg();
        _tree.File("b/2.jpg", jpeg);
        _tree.File("a/1.png", png);
        _tree.File("a-b/3.gif", SampleImages.Gif());
        _tree.File("Z.webp", SampleImages.WebP());
        _tree.File("a/sub/4.bmp", SampleImages.Bmp());

        var scan = new CatalogueScanner().Scan(_tree.Root);

        // Ordinal: 'Z' (0x5A) < 'a' (0x61), and '-' (0x2D) < '/' (0x2F).
        Assert.Equal(["Z.webp", "a-b/3.gif", "a/1.png", "a/sub/4.bmp", "b/2.jpg"], scan.Entries.Select(e => e.RelativePath));
        var first = scan.Entries.Single(e => e.RelativePath == "a/1.png");
        Assert.Equal(Path.Combine(_tree.Root, "a", "1.png"), first.FullPath);
        Assert.Equal(png.Length, first.Size);
        Assert.Equal(TempTree.FixedTime.Ticks, first.MtimeUtcTicks);
        Assert.Equal(ImageFormat.Png, first.Format);
        Assert.Null(first.ContentProblem);
        Assert.Equal(jpeg.Length, scan.Entries.Single(e => e.RelativePath == "b/2.jpg").Size);
        Assert.Equal(
            [ImageFormat.WebP, ImageFormat.Gif, ImageFormat.Png, ImageFormat.Bmp, ImageFormat.Jpeg],
            scan.Entries.Select(e => e.Format));
        Assert.Empty(scan.Problems);
        Assert.Equal(_tree.Root, scan.Root);
    }

    [Fact]
    public void Scan_recognises_images_by_content_whatever_their_name()
    {
        _tree.File("sku/photo.dat", SampleImages.Png());
        _tree.File("sku/no-extension", SampleImages.Jpeg());
        _tree.File("sku/really-png.jpg", SampleImages.Png());

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(
            [("sku/no-extension", ImageFormat.Jpeg), ("sku/photo.dat", ImageFormat.Png), ("sku/really-png.jpg", ImageFormat.Png)],
            scan.Entries.Select(e => (e.RelativePath, e.Format)));
        Assert.All(scan.Entries, e => Assert.True(e.IsImage));
    }

    [Fact]
    public void Scan_flags_a_text_file_named_like_a_photo_with_its_first_bytes()
    {
        _tree.Text("sku/fake.jpg", "fake photo, really text");

        var entry = Assert.Single(new CatalogueScanner().Scan(_tree.Root).Entries);

        Assert.Equal("sku/fake.jpg", entry.RelativePath);
        Assert.False(entry.IsImage);
        Assert.Equal(ImageFormat.Unknown, entry.Format);
        Assert.Contains("not JPEG, PNG, GIF, BMP, TIFF or WebP", entry.ContentProblem);
        Assert.Contains("66616B652070686F", entry.ContentProblem); // "fake pho" in hex.
    }

    [Fact]
    public void Scan_flags_an_empty_file_named_like_a_photo_without_opening_it()
    {
        _tree.File("sku/empty.png", []);
        var opened = new List<string>();
        var io = ScanIo.Default with { OpenRead = p => { opened.Add(p); return File.OpenRead(p); } };

        var entry = Assert.Single(new CatalogueScanner(ScanOptions.Default, io).Scan(_tree.Root).Entries);

        Assert.Equal(0, entry.Size);
        Assert.Contains("empty (0 bytes)", entry.ContentProblem);
        Assert.Empty(opened);
    }

    [Fact]
    public void Scan_skips_other_non_image_files_silently_but_counts_them()
    {
        _tree.Text("sku/notes.txt", "torque 12 Nm");
        _tree.Text("sku/parts.csv", "a,b");
        _tree.File("sku/empty.log", []);
        _tree.File("sku/p.png", SampleImages.Png());

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["sku/p.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal(3, scan.SkippedNonImages);
        Assert.Empty(scan.Problems);
    }

    [Fact]
    public void Scan_skips_hidden_files_and_folders_and_counts_them()
    {
        _tree.File(".hidden.jpg", SampleImages.Jpeg());
        _tree.File(".thumbs/a.jpg", SampleImages.Jpeg());
        _tree.File(".thumbs/b.jpg", SampleImages.Jpeg());
        _tree.File("sku/.DS_Store", [1, 2, 3]);
        _tree.File("sku/._p.jpg", SampleImages.Jpeg());
        _tree.File("sku/p.jpg", SampleImages.Jpeg());

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["sku/p.jpg"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal(4, scan.SkippedHidden); // .hidden.jpg, .thumbs (once, not entered), .DS_Store, ._p.jpg
        Assert.Equal(0, scan.SkippedNonImages);
    }

    [Fact]
    public void Scan_scans_a_hidden_root_because_the_caller_named_it()
    {
        _tree.File(".catalogue/sku/p.png", SampleImages.Png());

        var scan = new CatalogueScanner().Scan(_tree.PathOf(".catalogue"));

        Assert.Equal(["sku/p.png"], scan.Entries.Select(e => e.RelativePath));
    }

    [Fact]
    public void Scan_reports_a_folder_named_like_a_photo_and_still_scans_inside_it()
    {
        _tree.File("sku/x.jpg/inner.png", SampleImages.Png());

        var scan = new CatalogueScanner().Scan(_tree.Root);

        var problem = Assert.Single(scan.Problems);
        Assert.Equal(ScanProblemKind.FolderNamedLikeImage, problem.Kind);
        Assert.Equal("sku/x.jpg", problem.RelativePath);
        Assert.Contains(_tree.PathOf("sku/x.jpg"), problem.Message);
        Assert.Equal(["sku/x.jpg/inner.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Empty(scan.Unreadable);
    }

    [Fact]
    public void Scan_stops_at_the_depth_limit_and_marks_the_deeper_folder_unreadable()
    {
        _tree.File("a/p.png", SampleImages.Png());
        _tree.File("a/b/c/q.png", SampleImages.Png());

        var scan = new CatalogueScanner(new ScanOptions { MaxDepth = 1 }).Scan(_tree.Root);

        Assert.Equal(["a/p.png"], scan.Entries.Select(e => e.RelativePath));
        var problem = Assert.Single(scan.Problems);
        Assert.Equal((ScanProblemKind.TooDeep, "a/b"), (problem.Kind, problem.RelativePath));
        Assert.Equal(["a/b"], scan.Unreadable);
    }

    [Fact]
    public void Scanner_refuses_a_negative_depth_limit()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new CatalogueScanner(new ScanOptions { MaxDepth = -1 }));
    }

    [Fact]
    public void Scan_gives_the_same_result_twice()
    {
        _tree.File("b/2.jpg", SampleImages.Jpeg());
        _tree.File("a/1.png", SampleImages.Png());
        _tree.Text("a/fake.gif", "nope");

        var first = new CatalogueScanner().Scan(_tree.Root);
        var second = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(first.Entries, second.Entries);
    }

    [Fact]
    public void Scan_throws_a_clear_error_for_a_missing_root()
    {
        var missing = _tree.PathOf("nope");

        var error = Assert.Throws<DirectoryNotFoundException>(() => new CatalogueScanner().Scan(missing));

        Assert.Contains(missing, error.Message);
    }

    [Fact]
    public void Scan_throws_a_clear_error_when_the_root_is_a_file()
    {
        var file = _tree.File("p.png", SampleImages.Png());

        var error = Assert.Throws<DirectoryNotFoundException>(() => new CatalogueScanner().Scan(file));

        Assert.Contains("is a file", error.Message);
    }

    [Fact]
    public async Task Scan_never_opens_a_named_pipe_even_when_it_is_named_like_a_photo()
    {
        var pipe = _tree.PathOf("sku/pipe.jpg");
        _tree.Folder("sku");
        using (var mkfifo = Process.Start("mkfifo", [pipe]))
        {
            mkfifo.WaitForExit();
            Assert.Equal(0, mkfifo.ExitCode);
        }

        var scan = Task.Run(() => new CatalogueScanner().Scan(_tree.Root));
        var finished = await Task.WhenAny(scan, Task.Delay(TimeSpan.FromSeconds(30))) == scan;
        if (!finished)
        {
            // Release the blocked reader so the test run can end, then fail.
            using var writer = new FileStream(pipe, FileMode.Open, FileAccess.Write);
        }

        Assert.True(finished, "the scan blocked opening a named pipe");
        var entry = Assert.Single((await scan).Entries);
        Assert.Equal("sku/pipe.jpg", entry.RelativePath);
        Assert.Contains("empty (0 bytes)", entry.ContentProblem);
    }
}

using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

/// <summary>Symbolic links: followed by default, every real folder scanned once, loops reported.</summary>
public sealed class CatalogueScannerLinkTests : IDisposable
{
    private readonly TempTree _tree = new();
    private readonly TempTree _outside = new();

    public void Dispose()
    {
        _tree.Dispose();
        _outside.Dispose();
    }

    [Fact]
    public void Scan_reports_a_link_back_to_an_ancestor_as_a_loop_and_lists_each_photo_once()
    {
        _tree.File("a/p.png", SampleImages.Png());
        _tree.FolderLink("a/loop", "..");
        _tree.FolderLink("a/self", ".");

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["a/p.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal(
            [(ScanProblemKind.FolderAlreadyScanned, "a/loop"), (ScanProblemKind.FolderAlreadyScanned, "a/self")],
            scan.Problems.Select(p => (p.Kind, p.RelativePath)));
        Assert.All(scan.Problems, p => Assert.Contains("loop", p.Message));
        Assert.Empty(scan.Unreadable);
    }

    [Fact]
    public void Scan_lists_a_folder_under_its_own_path_even_when_a_link_to_it_sorts_first()
    {
        _tree.File("z-real/p.png", SampleImages.Png());
        _tree.FolderLink("a-link", "z-real");

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["z-real/p.png"], scan.Entries.Select(e => e.RelativePath));
        var problem = Assert.Single(scan.Problems);
        Assert.Equal((ScanProblemKind.FolderAlreadyScanned, "a-link"), (problem.Kind, problem.RelativePath));
        Assert.Contains("already scanned as " + _tree.PathOf("z-real"), problem.Message);
    }

    [Fact]
    public void Scan_follows_a_link_to_a_folder_outside_the_root_and_keeps_the_link_path()
    {
        _outside.File("photos/q.png", SampleImages.Png());
        _tree.FolderLink("sku-7", _outside.PathOf("photos"));

        var scan = new CatalogueScanner().Scan(_tree.Root);

        var entry = Assert.Single(scan.Entries);
        Assert.Equal("sku-7/q.png", entry.RelativePath);
        Assert.Equal(Path.Combine(_tree.Root, "sku-7", "q.png"), entry.FullPath);
        Assert.Empty(scan.Problems);
    }

    [Fact]
    public void Scan_enters_a_folder_reached_by_two_links_only_through_the_first_in_ordinal_order()
    {
        _outside.File("photos/q.png", SampleImages.Png());
        _tree.FolderLink("b", _outside.PathOf("photos"));
        _tree.FolderLink("a", _outside.PathOf("photos"));

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["a/q.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal([(ScanProblemKind.FolderAlreadyScanned, "b")], scan.Problems.Select(p => (p.Kind, p.RelativePath)));
    }

    [Fact]
    public void Scan_stops_a_loop_that_starts_outside_the_root()
    {
        _outside.File("photos/q.png", SampleImages.Png());
        _outside.FolderLink("photos/again", _outside.PathOf("photos"));
        _tree.FolderLink("ext", _outside.PathOf("photos"));

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["ext/q.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal([(ScanProblemKind.FolderAlreadyScanned, "ext/again")], scan.Problems.Select(p => (p.Kind, p.RelativePath)));
    }

    [Fact]
    public void Scan_follows_a_file_link_and_reports_the_target_size_and_time()
    {
        var jpeg = SampleImages.Jpeg();
        var targetTime = new DateTime(2023, 1, 2, 3, 4, 5, DateTimeKind.Utc);
        _tree.File("originals/p.jpg", jpeg, targetTime);
        _tree.FileLink("sku-1/p.jpg", Path.Combine("..", "originals", "p.jpg"));

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["originals/p.jpg", "sku-1/p.jpg"], scan.Entries.Select(e => e.RelativePath));
        var linked = scan.Entries[1];
        Assert.Equal(jpeg.Length, linked.Size);
        Assert.Equal(targetTime.Ticks, linked.MtimeUtcTicks);
        Assert.Equal(ImageFormat.Jpeg, linked.Format);
        Assert.Equal(_tree.PathOf("sku-1/p.jpg"), linked.FullPath);
    }

    [Fact]
    public void Scan_reports_broken_and_circular_file_links()
    {
        _tree.FileLink("sku/gone.jpg", "nowhere.jpg");
        _tree.FileLink("sku/ping.jpg", "pong.jpg");
        _tree.FileLink("sku/pong.jpg", "ping.jpg");
        _tree.File("sku/ok.png", SampleImages.Png());

        var scan = new CatalogueScanner().Scan(_tree.Root);

        Assert.Equal(["sku/ok.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal(
            [(ScanProblemKind.BrokenLink, "sku/gone.jpg"), (ScanProblemKind.BrokenLink, "sku/ping.jpg"), (ScanProblemKind.BrokenLink, "sku/pong.jpg")],
            scan.Problems.Select(p => (p.Kind, p.RelativePath)));
    }

    [Fact]
    public void Scan_skips_and_counts_links_when_following_is_off()
    {
        _outside.File("photos/q.png", SampleImages.Png());
        _tree.File("sku/p.png", SampleImages.Png());
        _tree.FolderLink("ext", _outside.PathOf("photos"));
        _tree.FileLink("sku/alias.png", "p.png");
        _tree.FileLink("sku/broken.png", "nowhere.png");

        var scan = new CatalogueScanner(new ScanOptions { FollowLinks = false }).Scan(_tree.Root);

        Assert.Equal(["sku/p.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal(3, scan.SkippedLinks);
        Assert.Empty(scan.Problems);
    }

    [Fact]
    public void Scan_accepts_a_root_given_through_a_link()
    {
        _outside.File("photos/sku/q.png", SampleImages.Png());
        var root = _tree.FolderLink("catalogue", _outside.PathOf("photos"));

        var scan = new CatalogueScanner(new ScanOptions { FollowLinks = false }).Scan(root);

        Assert.Equal(["sku/q.png"], scan.Entries.Select(e => e.RelativePath));
        Assert.Equal(Path.Combine(root, "sku", "q.png"), scan.Entries[0].FullPath);
    }
}

using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

/// <summary>Every plan category on a real folder tree, with the hash calls counted.</summary>
public sealed class ChangePlannerTests : IDisposable
{
    private readonly TempTree _tree = new();
    private readonly List<string> _hashed = [];

    public ChangePlannerTests()
    {
        _tree.File("BRK-1/a.jpg", SampleImages.Jpeg(10));
        _tree.File("BRK-1/b.jpg", SampleImages.Jpeg(20));
        _tree.File("HS-2/c.png", SampleImages.Png(30));
    }

    public void Dispose() => _tree.Dispose();

    [Fact]
    public void Plan_hashes_nothing_when_no_file_changed()
    {
        var known = Remember();

        var plan = Plan(known);

        Assert.All(plan.Items, i => Assert.Equal(ChangeKind.Unchanged, i.Kind));
        Assert.Equal(["BRK-1/a.jpg", "BRK-1/b.jpg", "HS-2/c.png"], plan.Items.Select(i => i.RelativePath));
        Assert.Empty(_hashed);
        Assert.Equal(0, plan.FilesHashed);
        Assert.Equal(known.Select(k => k.Sha256), plan.Items.Select(i => i.Sha256));
    }

    [Fact]
    public void Plan_trusts_size_and_time_so_an_edit_that_keeps_both_is_not_seen()
    {
        var known = Remember();
        var edited = SampleImages.Jpeg(10);
        edited[^3] ^= 0xFF;
        _tree.File("BRK-1/a.jpg", edited);

        var plan = Plan(known);

        Assert.Equal(ChangeKind.Unchanged, Item(plan, "BRK-1/a.jpg").Kind);
        Assert.Empty(_hashed);
    }

    [Fact]
    public void Plan_marks_a_file_whose_time_changed_but_content_did_not_as_touched()
    {
        var known = Remember();
        File.SetLastWriteTimeUtc(_tree.PathOf("BRK-1/a.jpg"), TempTree.FixedTime.AddHours(3));

        var plan = Plan(known);

        var item = Item(plan, "BRK-1/a.jpg");
        Assert.Equal(ChangeKind.Touched, item.Kind);
        Assert.True(item.MetadataDiffers);
        Assert.Equal(known[0].Sha256, item.Sha256);
        Assert.Equal([_tree.PathOf("BRK-1/a.jpg")], _hashed);
        Assert.Equal(1, plan.FilesHashed);
    }

    [Fact]
    public void Plan_marks_a_rewritten_file_changed_with_the_old_record_to_retire()
    {
        var known = Remember();
        _tree.File("BRK-1/a.jpg", SampleImages.Jpeg(99), TempTree.FixedTime.AddDays(1));

        var plan = Plan(known);

        var item = Item(plan, "BRK-1/a.jpg");
        Assert.Equal(ChangeKind.Changed, item.Kind);
        Assert.Same(known[0], item.Known);
        Assert.NotEqual(known[0].Sha256, item.Sha256);
        Assert.Single(_hashed);
    }

    [Fact]
    public void Plan_leaves_a_new_file_unhashed_when_it_cannot_be_a_move()
    {
        var known = Remember();
        _tree.File("HS-2/d.png", SampleImages.Png(77));

        var plan = Plan(known);

        var item = Item(plan, "HS-2/d.png");
        Assert.Equal((ChangeKind.New, (KnownPhoto?)null, "HS-2", (string?)null), (item.Kind, item.Known, item.Sku, item.Sha256));
        Assert.Empty(_hashed);
        Assert.Equal(3, plan.Count(ChangeKind.Unchanged));
    }

    [Fact]
    public void Plan_hashes_every_new_file_once_when_asked()
    {
        var known = Remember();
        var path = _tree.File("HS-2/d.png", SampleImages.Png(77));

        var plan = new ChangePlanner(CountingHash).Plan(known, Current(), options: new ChangePlanOptions { HashEveryNewFile = true });

        Assert.Equal(ContentHash.Sha256Hex(path), Item(plan, "HS-2/d.png").Sha256);
        Assert.Equal([path], _hashed);
    }

    [Fact]
    public void Plan_hashes_only_the_new_files_as_long_as_a_departed_photo()
    {
        var known = Remember();
        var departed = File.ReadAllBytes(_tree.PathOf("HS-2/c.png"));
        File.Delete(_tree.PathOf("HS-2/c.png"));
        var sameLength = (byte[])departed.Clone();
        sameLength[^5] ^= 0x01;
        var candidate = _tree.File("HS-2/same-length.png", sameLength);
        _tree.File("HS-2/other-length.png", [.. departed, 0]);

        var plan = Plan(known);

        Assert.Equal([candidate], _hashed);
        Assert.Equal(ChangeKind.New, Item(plan, "HS-2/same-length.png").Kind);
        Assert.Equal(ChangeKind.New, Item(plan, "HS-2/other-length.png").Kind);
        Assert.Equal(ChangeKind.Gone, Item(plan, "HS-2/c.png").Kind);
    }

    [Fact]
    public void Plan_recognises_a_renamed_file_as_moved_and_carries_its_record()
    {
        var known = Remember();
        File.Move(_tree.PathOf("BRK-1/b.jpg"), _tree.PathOf("BRK-1/b-front.jpg"));

        var plan = Plan(known);

        var item = Item(plan, "BRK-1/b-front.jpg");
        Assert.Equal(ChangeKind.Moved, item.Kind);
        Assert.Equal("BRK-1/b.jpg", item.Known!.RelativePath);
        Assert.Equal(known[1].NodeId, item.Known.NodeId);
        Assert.False(item.SkuDiffers);
        Assert.DoesNotContain(plan.Items, i => i.Kind == ChangeKind.Gone);
        Assert.Equal([_tree.PathOf("BRK-1/b-front.jpg")], _hashed);
    }

    [Fact]
    public void Plan_moves_a_photo_to_another_sku_folder_as_a_move_with_a_new_sku()
    {
        var known = Remember();
        Directory.CreateDirectory(_tree.PathOf("BRK-9"));
        File.Move(_tree.PathOf("BRK-1/b.jpg"), _tree.PathOf("BRK-9/b.jpg"));

        var item = Item(Plan(known), "BRK-9/b.jpg");

        Assert.Equal(ChangeKind.Moved, item.Kind);
        Assert.True(item.SkuDiffers);
        Assert.Equal(("BRK-1", "BRK-9"), (item.Known!.Sku, item.Sku));
    }

    [Fact]
    public void Plan_marks_a_new_sku_for_the_same_content_as_sku_changed_without_hashing()
    {
        var known = Remember();
        var current = Current().Select(p => p.Entry.RelativePath == "HS-2/c.png" ? p with { Sku = "HS-3" } : p).ToList();

        var plan = new ChangePlanner(CountingHash).Plan(known, current);

        var item = Item(plan, "HS-2/c.png");
        Assert.Equal(ChangeKind.SkuChanged, item.Kind);
        Assert.Equal(("HS-2", "HS-3"), (item.Known!.Sku, item.Sku));
        Assert.False(item.MetadataDiffers);
        Assert.Empty(_hashed);
    }

    [Fact]
    public void Plan_never_lets_an_unmapped_photo_erase_a_known_sku()
    {
        var known = Remember();
        var current = Current().Select(p => p with { Sku = null }).ToList();

        var plan = new ChangePlanner(CountingHash).Plan(known, current);

        Assert.All(plan.Items, i => Assert.Equal(ChangeKind.Unchanged, i.Kind));
        Assert.Equal(["BRK-1", "BRK-1", "HS-2"], plan.Items.Select(i => i.Sku));
    }

    [Fact]
    public void Plan_retires_a_deleted_photo_or_keeps_it_when_asked()
    {
        var known = Remember();
        File.Delete(_tree.PathOf("HS-2/c.png"));

        var retire = Plan(known);
        var keep = new ChangePlanner(CountingHash).Plan(known, Current(), options: new ChangePlanOptions { KeepMissing = true });

        Assert.Equal((ChangeKind.Gone, (MappedEntry?)null), (Item(retire, "HS-2/c.png").Kind, Item(retire, "HS-2/c.png").Current));
        Assert.Equal(ChangeKind.Missing, Item(keep, "HS-2/c.png").Kind);
        Assert.Empty(_hashed);
    }

    [Fact]
    public void Plan_keeps_a_byte_copy_of_a_photo_still_in_place_as_a_second_photo_and_reports_it()
    {
        var known = Remember();
        File.Copy(_tree.PathOf("BRK-1/a.jpg"), _tree.PathOf("HS-2/a-copy.jpg"));

        var plan = new ChangePlanner(CountingHash).Plan(known, Current(), options: new ChangePlanOptions { HashEveryNewFile = true });

        Assert.Equal(ChangeKind.New, Item(plan, "HS-2/a-copy.jpg").Kind);
        Assert.Equal(ChangeKind.Unchanged, Item(plan, "BRK-1/a.jpg").Kind);
        Assert.Equal([["BRK-1/a.jpg", "HS-2/a-copy.jpg"]], plan.DuplicateContent);
    }

    [Fact]
    public void Plan_moves_a_gone_photo_to_the_first_of_two_new_copies_and_adds_the_other()
    {
        var known = Remember();
        File.Copy(_tree.PathOf("BRK-1/a.jpg"), _tree.PathOf("HS-2/z.jpg"));
        File.Move(_tree.PathOf("BRK-1/a.jpg"), _tree.PathOf("HS-2/y.jpg"));

        var plan = Plan(known);

        Assert.Equal((ChangeKind.Moved, "BRK-1/a.jpg"), (Item(plan, "HS-2/y.jpg").Kind, Item(plan, "HS-2/y.jpg").Known!.RelativePath));
        Assert.Equal(ChangeKind.New, Item(plan, "HS-2/z.jpg").Kind);
        Assert.DoesNotContain(plan.Items, i => i.RelativePath == "BRK-1/a.jpg");
        Assert.Equal([["HS-2/y.jpg", "HS-2/z.jpg"]], plan.DuplicateContent);
    }

    [Fact]
    public void Plan_pairs_gone_duplicates_with_new_paths_in_path_order_and_retires_the_rest()
    {
        File.Copy(_tree.PathOf("BRK-1/a.jpg"), _tree.PathOf("BRK-1/a2.jpg"));
        var known = Remember();
        Directory.CreateDirectory(_tree.PathOf("NEW"));
        File.Move(_tree.PathOf("BRK-1/a2.jpg"), _tree.PathOf("NEW/one.jpg"));
        File.Delete(_tree.PathOf("BRK-1/a.jpg"));

        var plan = Plan(known);

        Assert.Equal("BRK-1/a.jpg", Item(plan, "NEW/one.jpg").Known!.RelativePath);
        Assert.Equal(ChangeKind.Gone, Item(plan, "BRK-1/a2.jpg").Kind);
    }

    [Fact]
    public void Plan_does_not_move_from_a_path_that_still_exists_with_new_content()
    {
        var known = Remember();
        File.Copy(_tree.PathOf("BRK-1/a.jpg"), _tree.PathOf("BRK-1/a-old.jpg"));
        _tree.File("BRK-1/a.jpg", SampleImages.Jpeg(55), TempTree.FixedTime.AddDays(2));

        var plan = Plan(known);

        Assert.Equal(ChangeKind.Changed, Item(plan, "BRK-1/a.jpg").Kind);
        Assert.Equal(ChangeKind.New, Item(plan, "BRK-1/a-old.jpg").Kind);
    }

    [Fact]
    public void Plan_keeps_photos_under_an_unreadable_folder_and_never_moves_them()
    {
        var known = Remember();
        File.Copy(_tree.PathOf("HS-2/c.png"), _tree.PathOf("BRK-1/c-copy.png"));
        var current = Current().Where(p => !p.Entry.RelativePath.StartsWith("HS-2/", StringComparison.Ordinal)).ToList();

        var plan = new ChangePlanner(CountingHash).Plan(known, current, unreadable: ["HS-2"]);

        Assert.Equal(ChangeKind.Unverified, Item(plan, "HS-2/c.png").Kind);
        Assert.Equal(ChangeKind.New, Item(plan, "BRK-1/c-copy.png").Kind);
    }

    [Theory]
    [InlineData("", "Unverified")]
    [InlineData("HS-2/c.png", "Unverified")]
    [InlineData("HS", "Gone")]
    [InlineData("HS-2/c", "Gone")]
    public void Plan_matches_unreadable_paths_by_whole_path_segments(string unreadable, string expected)
    {
        var known = Remember();
        var current = Current().Where(p => p.Entry.RelativePath != "HS-2/c.png").ToList();

        var plan = new ChangePlanner(CountingHash).Plan(known, current, unreadable: [unreadable]);

        Assert.Equal(Enum.Parse<ChangeKind>(expected), Item(plan, "HS-2/c.png").Kind);
    }

    [Fact]
    public void Plan_records_a_file_that_cannot_be_hashed_and_keeps_its_known_record()
    {
        var known = Remember();
        File.SetLastWriteTimeUtc(_tree.PathOf("BRK-1/a.jpg"), TempTree.FixedTime.AddHours(1));
        _tree.File("BRK-1/new.jpg", SampleImages.Jpeg(66));
        var planner = new ChangePlanner(_ => throw new IOException("Input/output error"));

        var plan = planner.Plan(known, Current(), options: new ChangePlanOptions { HashEveryNewFile = true });

        var changed = Item(plan, "BRK-1/a.jpg");
        Assert.Equal((ChangeKind.HashFailed, known[0]), (changed.Kind, changed.Known));
        Assert.Contains("Input/output error", changed.Error);
        Assert.Contains(_tree.PathOf("BRK-1/a.jpg"), changed.Error);
        Assert.Equal((ChangeKind.HashFailed, (KnownPhoto?)null), (Item(plan, "BRK-1/new.jpg").Kind, Item(plan, "BRK-1/new.jpg").Known));
        Assert.Equal(2, plan.FilesHashed);
    }

    [Fact]
    public void Plan_refuses_a_known_list_with_the_same_path_twice()
    {
        var known = Remember();

        var error = Assert.Throws<ArgumentException>(() => new ChangePlanner(CountingHash).Plan([.. known, known[0]], Current()));

        Assert.Contains("BRK-1/a.jpg twice", error.Message);
    }

    [Fact]
    public void Plan_gives_the_same_items_in_path_order_every_time()
    {
        var known = Remember();
        File.Move(_tree.PathOf("BRK-1/a.jpg"), _tree.PathOf("HS-2/a.jpg"));
        _tree.File("AAA/first.png", SampleImages.Png(1));
        File.Delete(_tree.PathOf("HS-2/c.png"));

        var first = Plan(known);
        var second = Plan(known);

        Assert.Equal(first.Items, second.Items);
        Assert.Equal(
            [("AAA/first.png", ChangeKind.New), ("BRK-1/b.jpg", ChangeKind.Unchanged), ("HS-2/a.jpg", ChangeKind.Moved), ("HS-2/c.png", ChangeKind.Gone)],
            first.Items.Select(i => (i.RelativePath, i.Kind)));
    }

    private string CountingHash(string path)
    {
        _hashed.Add(path);
        return ContentHash.Sha256Hex(path);
    }

    private ChangePlan Plan(IReadOnlyList<KnownPhoto> known) => new ChangePlanner(CountingHash).Plan(known, Current());

    private IReadOnlyList<MappedEntry> Current() => new FolderSkuMapping().Map(new CatalogueScanner().Scan(_tree.Root).Entries).Photos;

    // What an ingest of the tree as it is now would have recorded.
    private KnownPhoto[] Remember() =>
    [
        .. Current().Select((p, i) => new KnownPhoto(p.Entry.RelativePath, p.Entry.Size, p.Entry.MtimeUtcTicks,
            ContentHash.Sha256Hex(p.Entry.FullPath), p.Sku, 100 + i, KnownPhotoStatus.Indexed)),
    ];

    private static PlannedChange Item(ChangePlan plan, string relativePath) => plan.Items.Single(i => i.RelativePath == relativePath);
}

using Lookup.Store;
using Lookup.Sweeps;
using Lookup.Tests.Store;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// The sweep and decision collections of the index file (<see cref="SweepStore"/>, <see cref="DecisionStore"/>), and
/// <see cref="Dismissals"/> resolving keys and paths against them. (These store types exist only for sweeps, so their
/// tests live with the sweep tests.)
/// </summary>
public sealed class SweepStoreTests : IDisposable
{
    private static readonly DateTime Noon = new(2026, 3, 1, 12, 0, 0, DateTimeKind.Utc);
    private readonly TempIndex _index = new();

    [Fact]
    public void Save_numbers_sweeps_from_1_and_reads_them_back_newest_first()
    {
        using var file = IndexFile.Open(_index.Path, IndexAccess.Write);
        var store = new SweepStore(file);
        Assert.Null(store.Latest());

        var first = store.Save(Sweep(findings: 2), [Finding(1, "aa"), Finding(2, "bb")]);
        var second = store.Save(Sweep(findings: 1) with { NewFindings = 1 }, [Finding(1, "cc")]);

        Assert.Equal((1, 2), (first, second));
        Assert.Equal([2, 1], store.History().Select(s => s.Number));
        var latest = store.Latest()!;
        Assert.Equal(Sweep(findings: 1) with { Number = 2, NewFindings = 1, FindingsByKind = latest.FindingsByKind }, latest);
        Assert.Equal(1, latest.FindingsByKind["copies"]);
        Assert.Equal([Key("aa"), Key("bb")], store.KeysOf(1).Order());
        var stored = store.FindingsOf(1)[1];
        Assert.Equal((1, 2, FindingKind.CopiesInOneSku), (stored.Sweep, stored.Order, stored.Kind));
        Assert.Equal(new StoredMember("S/b.jpg", "S", "bb"), stored.Members[1]);
        Assert.Equal(new StoredPair(PairKey("bb"), "S/a.jpg", "S/b.jpg", 0.25f, "copy (resized)"), stored.Pairs[0]);
    }

    [Fact]
    public void Save_keeps_the_findings_of_the_last_sweeps_only_and_every_summary()
    {
        using var file = IndexFile.Open(_index.Path, IndexAccess.Write);
        var store = new SweepStore(file);
        var sweeps = SweepStore.FindingsKeptForSweeps + 2;

        for (var n = 1; n <= sweeps; n++)
        {
            store.Save(Sweep(findings: 1), [Finding(1, $"{n:x2}")]);
        }

        Assert.Equal(sweeps, store.History().Count());
        Assert.Empty(store.FindingsOf(1));
        Assert.Empty(store.FindingsOf(2));
        Assert.Single(store.FindingsOf(3));
        Assert.Single(store.FindingsOf(sweeps));
    }

    [Fact]
    public void The_first_decision_on_a_key_stands()
    {
        using var file = IndexFile.Open(_index.Path, IndexAccess.Write);
        var decisions = new DecisionStore(file);
        var first = new ReviewerDecision("k1", DecisionTarget.Pair, "ana", Noon, "mirror-image parts", ["A/l.jpg", "B/r.jpg"], "f1", "command");

        Assert.Null(decisions.TryAdd(first));
        var standing = decisions.TryAdd(first with { Reviewer = "ben", Note = "" });

        Assert.Equal(first with { Paths = [] }, standing! with { Paths = [] });
        Assert.Equal(first.Paths, standing.Paths);
        Assert.Equal(first with { Paths = [] }, Assert.Single(decisions.All()) with { Paths = [] });
        Assert.Equal("f1", decisions.Find("k1")!.ViaFinding);
    }

    [Fact]
    public void A_read_only_index_without_sweeps_has_no_sweeps_findings_or_decisions()
    {
        using (IndexFile.Open(_index.Path, IndexAccess.Write))
        {
        }

        using var file = IndexFile.Open(_index.Path, IndexAccess.Read);

        Assert.Null(new SweepStore(file).Latest());
        Assert.Empty(new SweepStore(file).FindByKeyPrefix("abcdef12"));
        Assert.Empty(new DecisionStore(file).All());
    }

    [Fact]
    public void Dismissals_resolve_a_unique_finding_or_pair_prefix_and_refuse_an_ambiguous_one()
    {
        using var file = IndexFile.Open(_index.Path, IndexAccess.Write);
        new SweepStore(file).Save(Sweep(findings: 2), [Finding(1, "abcdef0a1"), Finding(2, "abcdef0a2")]);

        var outcomes = Dismissals.Apply(
            file,
            [DismissRequest.ForKey("ABCDEF0"), DismissRequest.ForKey("ABCDEF0A"), DismissRequest.ForKey("abcdef0a1"), DismissRequest.ForKey(PairKey("abcdef0a2")[..12])],
            "ana",
            _index.Directory,
            new FixedClock(Noon));

        Assert.Equal(
            [DismissStatus.NotFound, DismissStatus.Ambiguous, DismissStatus.Dismissed, DismissStatus.Dismissed],
            outcomes.Select(o => o.Status));
        Assert.Contains("is not a key: give the 8 to 32 hex digits", outcomes[0].Message, StringComparison.Ordinal);
        Assert.Contains("fits 2 findings", outcomes[1].Message, StringComparison.Ordinal);
        Assert.Equal((DecisionTarget.Finding, Key("abcdef0a1"), 1), (outcomes[2].Target, outcomes[2].Key, outcomes[2].PairsDismissed));
        Assert.Equal((DecisionTarget.Pair, PairKey("abcdef0a2")), (outcomes[3].Target, outcomes[3].Key));
        var recorded = new DecisionStore(file).All();
        Assert.Equal([Key("abcdef0a1"), PairKey("abcdef0a1"), PairKey("abcdef0a2")], recorded.Select(d => d.Key).Order());
        Assert.All(recorded, d => Assert.Equal(("ana", Noon), (d.Reviewer, d.DecidedUtc)));
        Assert.Equal(Key("abcdef0a1"), recorded.Single(d => d.Key == PairKey("abcdef0a1")).ViaFinding);
    }

    [Fact]
    public void Dismissals_find_a_photo_by_its_relative_path_or_by_a_file_path_under_the_catalogue_root()
    {
        var photos = SyntheticCatalogue.Build();
        SyntheticIndex.Add(_index.Path, photos);
        using var file = IndexFile.Open(_index.Path, IndexAccess.Write);
        file.InTransaction(() => new CatalogueSettings(_index.Directory, "folder", "{}", "synthetic", Noon).Write(file));
        var (c1, d1) = (photos.Single(p => p.Path == "C/c1.png"), photos.Single(p => p.Path == "D/d1.png"));

        var outcomes = Dismissals.Apply(
            file,
            [DismissRequest.ForPair("./C/c1.png", Path.Combine(_index.Directory, "D", "d1.png")), DismissRequest.ForPair("C\\c1.png", "../D/d1.png")],
            "ana",
            Path.Combine(_index.Directory, "C"));

        Assert.Equal(DismissStatus.Dismissed, outcomes[0].Status);
        Assert.Equal(FindingKeys.Pair(c1.Sha256, d1.Sha256), outcomes[0].Key);
        Assert.Equal(["C/c1.png", "D/d1.png"], outcomes[0].Paths);
        Assert.Equal(DismissStatus.AlreadyDismissed, outcomes[1].Status);
    }

    public void Dispose() => _index.Dispose();

    /// <summary>A 32-digit finding key starting with <paramref name="head"/>.</summary>
    private static string Key(string head) => (head + new string('0', 32))[..32];

    /// <summary>A 32-digit pair key starting with <paramref name="head"/>.</summary>
    private static string PairKey(string head) => (head + new string('1', 32))[..32];

    private static StoredSweep Sweep(int findings) => new(
        0, Noon, Noon.AddSeconds(5), 10, 4, 12, findings, findings, new Dictionary<string, int> { ["copies"] = findings }, "{}", "ana@host");

    private static StoredFinding Finding(int order, string keyHead) => new(
        0,
        order,
        FindingKind.CopiesInOneSku,
        Key(keyHead),
        [new StoredMember("S/a.jpg", "S", "aa"), new StoredMember("S/b.jpg", "S", keyHead)],
        [new StoredPair(PairKey(keyHead), "S/a.jpg", "S/b.jpg", 0.25f, "copy (resized)")]);

    private sealed class FixedClock(DateTime now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => new(now);
    }
}

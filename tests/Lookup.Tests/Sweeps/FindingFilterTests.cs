using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class FindingFilterTests
{
    private static readonly SweepReport Report = SweepEngine.Run(SyntheticCatalogue.Build(), Source());

    [Fact]
    public void Apply_with_no_decisions_and_no_history_keeps_everything()
    {
        var (findings, suppressed, already) = FindingFilter.Apply(Report.Findings, ReviewDecisions.None, null);

        Assert.Equal(Report.Findings.Select(f => f.Key), findings.Select(f => f.Key));
        Assert.Equal((0, 0), (suppressed, already));
    }

    [Fact]
    public void Apply_for_new_only_drops_what_the_previous_sweep_reported()
    {
        var previous = Report.Findings.Where(f => f.Kind != FindingKind.CopiesInOneSku).Select(f => f.Key).ToHashSet();

        var (findings, _, already) = FindingFilter.Apply(Report.Findings, ReviewDecisions.None, previous);

        Assert.Equal(FindingKind.CopiesInOneSku, Assert.Single(findings).Kind);
        Assert.Equal(Report.Findings.Count - 1, already);
    }

    [Fact]
    public void Apply_drops_a_dismissed_finding_and_it_stays_dismissed_in_the_next_sweep()
    {
        var copies = Report.Findings.Single(f => f.Kind == FindingKind.CopiesInOneSku);
        var decisions = ReviewDecisions.None.DismissFinding(copies);

        var next = SweepEngine.Run(SyntheticCatalogue.Build(), Source()).Filtered(decisions, null);

        Assert.DoesNotContain(next.Findings, f => f.Kind == FindingKind.CopiesInOneSku);
        Assert.Equal(1, next.Counts.SuppressedByDecisions);
    }

    [Fact]
    public void Apply_removes_a_dismissed_pair_from_a_larger_group()
    {
        // {e1, e2, e3}, three files with the same pixels: dismiss e2–e3. Both stay tied to e1, so the group keeps its
        // three photos (and its key) and lists two pairs.
        var group = ThreeCopies();
        var decisions = ReviewDecisions.None.DismissPair(Sha(group, "E/e2.png"), Sha(group, "E/e3.png"));

        var (findings, _, _) = FindingFilter.Apply([group], decisions, null);

        var kept = Assert.Single(findings);
        Assert.Equal(3, kept.Members.Count);
        Assert.Equal(2, kept.Pairs.Count);
        Assert.Equal(group.Key, kept.Key);
    }

    [Fact]
    public void Apply_splits_off_a_photo_whose_every_pair_in_the_group_is_dismissed()
    {
        var group = ThreeCopies();
        var decisions = ReviewDecisions.None
            .DismissPair(Sha(group, "E/e1.png"), Sha(group, "E/e3.png"))
            .DismissPair(Sha(group, "E/e2.png"), Sha(group, "E/e3.png"));

        var (findings, _, _) = FindingFilter.Apply([group], decisions, null);

        var kept = Assert.Single(findings);
        Assert.Equal(["E/e1.png", "E/e2.png"], SyntheticCatalogue.Paths(kept));
        Assert.NotEqual(group.Key, kept.Key);
    }

    [Fact]
    public void Apply_treats_byte_identical_files_as_one_picture_in_decisions()
    {
        // a1 and b1 are the same file under two SKUs. "a2 is not a duplicate of b1" says the same of a1, since a pair
        // key rests on content: a2 leaves the group, and a1 and b1 remain as identical files under two SKUs.
        var group = Report.Findings.Single(f => f.Kind == FindingKind.SamePhotoSeveralSkus);
        var decisions = ReviewDecisions.None.DismissPair(Sha(group, "A/a2.png"), Sha(group, "B/b1.png"));

        var (findings, _, _) = FindingFilter.Apply([group], decisions, null);

        var kept = Assert.Single(findings);
        Assert.Equal(FindingKind.SamePhotoSeveralSkus, kept.Kind);
        Assert.Equal(["A/a1.png", "B/b1.png"], SyntheticCatalogue.Paths(kept));
    }

    [Fact]
    public void Apply_suppresses_a_group_all_of_whose_pairs_are_dismissed()
    {
        var group = ThreeCopies();
        var decisions = group.Pairs.Aggregate(ReviewDecisions.None, (d, p) =>
        {
            var a = group.Members.Single(m => m.PhotoId == p.FirstPhotoId).Sha256;
            var b = group.Members.Single(m => m.PhotoId == p.SecondPhotoId).Sha256;
            return d.DismissPair(a, b);
        });

        var (findings, suppressed, _) = FindingFilter.Apply([group], decisions, null);

        Assert.Empty(findings);
        Assert.Equal(1, suppressed);
    }

    private static string Sha(SweepFinding finding, string path) => finding.Members.Single(m => m.Path == path).Sha256;

    /// <summary>The synthetic catalogue with a third file of e1's pixels: copies {e1, e2, e3} in SKU E.</summary>
    private static SweepFinding ThreeCopies()
    {
        var photos = SyntheticCatalogue.Build();
        var e1 = photos.Single(p => p.Path == "E/e1.png");
        photos.Add(e1 with { Id = 999, Path = "E/e3.png", Sha256 = new string('e', 64) });
        return SweepEngine.Run(photos, new ExactNeighbourSource(photos)).Findings.Single(f => f.Kind == FindingKind.CopiesInOneSku);
    }

    [Fact]
    public void Apply_brings_back_a_dismissed_group_with_only_the_new_photos_pairs_when_a_copy_joins_it()
    {
        var photos = SyntheticCatalogue.Build();
        var first = SweepEngine.Run(photos, new ExactNeighbourSource(photos));
        var decisions = ReviewDecisions.None.DismissFinding(first.Findings.Single(f => f.Kind == FindingKind.CopiesInOneSku));

        // A third copy of e1 arrives under SKU E.
        var e1 = photos.Single(p => p.Path == "E/e1.png");
        photos.Add(e1 with { Id = 999, Path = "E/e3.png", Sha256 = new string('e', 64) });
        var next = SweepEngine.Run(photos, new ExactNeighbourSource(photos)).Filtered(decisions, null);

        var back = Assert.Single(next.Findings, f => f.Kind == FindingKind.CopiesInOneSku);
        Assert.Equal(["E/e1.png", "E/e2.png", "E/e3.png"], SyntheticCatalogue.Paths(back));
        Assert.Equal(2, back.Pairs.Count);
        Assert.All(back.Pairs, p => Assert.Contains(999, new[] { p.FirstPhotoId, p.SecondPhotoId }));
    }

    private static ExactNeighbourSource Source() => new(SyntheticCatalogue.Build());
}

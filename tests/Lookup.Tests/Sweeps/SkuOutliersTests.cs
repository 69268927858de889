using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class SkuOutliersTests
{
    private readonly Random _random = new(99);

    [Fact]
    public void Find_in_a_sku_of_two_flags_the_photo_that_has_the_nearer_other_sku()
    {
        // X has x1 and x2, 0.5 apart. x2 sits 0.1 from y1 of SKU Y; x1 has nothing near.
        var vx = SweepFixtures.RandomUnit(_random);
        var vy = SweepFixtures.RandomUnit(_random);
        var photos = new List<SweepPhoto>
        {
            Photo(1, "X", vx),
            Photo(2, "X", SweepFixtures.Near(vy, 0.1, _random)),
            Photo(3, "Y", vy),
            Photo(4, "Y", SweepFixtures.Near(vy, 0.02, _random)),
        };

        var found = Find(photos);

        var finding = Assert.Single(found);
        Assert.Equal("X/2", finding.Members.Single(m => m.Role == MemberRole.Flagged).Path);
        Assert.Equal("Y", finding.Outlier!.NearestOtherSku);
        Assert.Null(finding.Outlier.OwnSkuSpread);
    }

    [Fact]
    public void Find_in_a_sku_of_two_flags_only_one_photo_when_both_have_another_sku_nearer()
    {
        var vy = SweepFixtures.RandomUnit(_random);
        var vz = SweepFixtures.RandomUnit(_random);
        var photos = new List<SweepPhoto>
        {
            Photo(1, "X", SweepFixtures.Near(vz, 0.12, _random)),
            Photo(2, "X", SweepFixtures.Near(vy, 0.05, _random)),
            Photo(3, "Y", vy),
            Photo(4, "Z", vz),
        };

        var finding = Assert.Single(Find(photos), f => f.Members[0].Sku == "X");

        Assert.Equal("X/2", finding.Members.Single(m => m.Role == MemberRole.Flagged).Path);
    }

    [Fact]
    public void Find_leaves_alone_a_far_photo_that_no_other_sku_is_nearer_to()
    {
        var vx = SweepFixtures.RandomUnit(_random);
        var photos = new List<SweepPhoto>
        {
            Photo(1, "X", vx),
            Photo(2, "X", SweepFixtures.Near(vx, 0.03, _random)),
            Photo(3, "X", SweepFixtures.Near(vx, 0.5, _random)),
            Photo(4, "Y", SweepFixtures.RandomUnit(_random)),
        };

        Assert.Empty(Find(photos));
    }

    [Fact]
    public void Find_leaves_alone_a_sku_whose_photos_are_all_equally_spread()
    {
        // Four views, each about 0.3 from the others: no photo stands out, even with another SKU nearby.
        var vx = SweepFixtures.RandomUnit(_random);
        var views = Enumerable.Range(0, 4).Select(_ => SweepFixtures.Near(vx, 0.15, _random)).ToList();
        var photos = views.Select((v, i) => Photo(i + 1, "X", v)).ToList();
        photos.Add(Photo(9, "Y", SweepFixtures.Near(views[0], 0.1, _random)));

        Assert.Empty(Find(photos));
    }

    [Fact]
    public void Find_flags_a_far_photo_in_a_sku_larger_than_the_exact_limit()
    {
        // 300 photos of X within 0.02 of a centre, and one 0.6 away and 0.05 from Y.
        var vx = SweepFixtures.RandomUnit(_random);
        var vy = SweepFixtures.RandomUnit(_random);
        var photos = Enumerable.Range(0, 300).Select(i => Photo(i, "X", SweepFixtures.Near(vx, 0.02, _random))).ToList();
        photos.Add(Photo(1000, "X", SweepFixtures.Near(vy, 0.05, _random)));
        photos.Add(Photo(1001, "Y", vy));
        photos.Add(Photo(1002, "Y", SweepFixtures.Near(vy, 0.01, _random)));

        var finding = Assert.Single(Find(photos));

        Assert.Equal("X/1000", finding.Members.Single(m => m.Role == MemberRole.Flagged).Path);
    }

    // Finishes as FinishSignature measures them; zinc and black oxide values as measured on the demo catalogue's
    // studio photos (DEVELOPERS.md § Sweeps), brass well apart from both.
    private static readonly FinishSignature Zinc = new(0.05, 0.02, -0.4);
    private static readonly FinishSignature BlackOxide = new(0.03, -0.005, -0.8);
    private static readonly FinishSignature Brass = new(-0.35, -0.09, -0.3);

    [Fact]
    public void Find_flags_a_photo_in_the_middle_of_its_sku_whose_finish_is_another_skus_and_that_sku_is_nearer()
    {
        // X: four photos about 0.2 apart. x4 lies 0.05 from y1, nearer than its own photos but well inside X's spread,
        // so distances alone never flag it; its finish is Y's.
        var vx = SweepFixtures.RandomUnit(_random);
        var x4 = SweepFixtures.Near(vx, 0.1, _random);
        var y1 = SweepFixtures.Near(x4, 0.05, _random);
        var photos = new List<SweepPhoto>
        {
            Photo(1, "X", SweepFixtures.Near(vx, 0.1, _random)),
            Photo(2, "X", SweepFixtures.Near(vx, 0.1, _random)),
            Photo(3, "X", SweepFixtures.Near(vx, 0.1, _random)),
            Photo(4, "X", x4),
            Photo(5, "Y", y1),
            Photo(6, "Y", SweepFixtures.Near(y1, 0.02, _random)),
        };
        FinishSignature[] finishes = [Zinc, Zinc, Zinc, BlackOxide, BlackOxide, BlackOxide];

        Assert.Empty(Find(photos));
        var finding = Assert.Single(Find(photos, finishes));

        Assert.Equal("X/4", finding.Members.Single(m => m.Role == MemberRole.Flagged).Path);
        Assert.Equal("Y", finding.Outlier!.NearestOtherSku);
        Assert.True(finding.Outlier.FinishDifference >= SkuOutliers.FinishMinDifference, $"{finding.Outlier.FinishDifference}");
        Assert.Contains("another finish", finding.Verdict, StringComparison.Ordinal);
        Assert.Empty(Find(photos, [Zinc, Zinc, Zinc, Zinc, BlackOxide, BlackOxide]));
    }

    [Fact]
    public void Find_does_not_flag_a_photo_whose_finish_differs_when_the_nearer_sku_has_a_third_finish()
    {
        var vx = SweepFixtures.RandomUnit(_random);
        var x4 = SweepFixtures.Near(vx, 0.1, _random);
        var y1 = SweepFixtures.Near(x4, 0.05, _random);
        var photos = new List<SweepPhoto>
        {
            Photo(1, "X", SweepFixtures.Near(vx, 0.1, _random)),
            Photo(2, "X", SweepFixtures.Near(vx, 0.1, _random)),
            Photo(3, "X", SweepFixtures.Near(vx, 0.1, _random)),
            Photo(4, "X", x4),
            Photo(5, "Y", y1),
            Photo(6, "Y", SweepFixtures.Near(y1, 0.02, _random)),
        };

        Assert.Empty(Find(photos, [Zinc, Zinc, Zinc, BlackOxide, Brass, Brass]));
    }

    [Fact]
    public void Find_withdraws_a_distance_flag_when_the_photo_has_its_own_skus_finish_and_plainly_not_the_other()
    {
        // As in the first test: x2 sits 0.1 from SKU Y, x1 has nothing near; but x2 is zinc like x1 and Y is brass.
        var vx = SweepFixtures.RandomUnit(_random);
        var vy = SweepFixtures.RandomUnit(_random);
        var photos = new List<SweepPhoto>
        {
            Photo(1, "X", vx),
            Photo(2, "X", SweepFixtures.Near(vy, 0.1, _random)),
            Photo(3, "Y", vy),
            Photo(4, "Y", SweepFixtures.Near(vy, 0.02, _random)),
        };

        Assert.Single(Find(photos));
        Assert.Single(Find(photos, [Zinc, Zinc, Zinc, Zinc]));
        Assert.Empty(Find(photos, [Zinc, Zinc, Brass, Brass]));
    }

    private static List<SweepFinding> Find(List<SweepPhoto> photos, FinishSignature?[]? finishes = null) => SkuOutliers.Find(
        photos,
        photos.Select((p, i) => (p.Id, i)).ToDictionary(x => x.Id, x => x.i),
        new ExactNeighbourSource(photos),
        new SweepOptions(),
        new ParallelOptions(),
        finishes);

    private static SweepPhoto Photo(int id, string sku, float[] v) =>
        new(id, sku, $"{sku}/{id}", $"{id:x64}", 0, 100, 100, 1000, v);
}

using Lookup.Graph;
using Lookup.Matching;
using Lookup.Store;

namespace Lookup.Tests.Matching;

/// <summary>The ranking rules on a small in-memory catalogue whose distances are worked out by hand.</summary>
public sealed class SkuRankerTests
{
    private static readonly VerdictThresholds Thresholds = VerdictThresholds.Default with { Copy = 0.05f, SamePart = 0.30f, MinMargin = 0.05f };

    private readonly FakeCatalogue catalogue = new();
    private readonly int a1;
    private readonly int a2;
    private readonly int c1;

    public SkuRankerTests()
    {
        a1 = catalogue.Add("A", "A/front.jpg", V(1, 0, 0, 0));
        a2 = catalogue.Add("A", "A/side.jpg", V(1, 1, 0, 0));
        catalogue.Add("B", "B/front.jpg", V(1, 0, 1, 0));
        c1 = catalogue.Add("C", "C/front.jpg", V(0, 0, 0, 1), sha256: "c-bytes");
    }

    [Fact]
    public void Each_SKU_is_scored_by_its_nearest_photo_and_counts_its_photos_within_the_same_part_distance()
    {
        var query = Photo("q", V(1, 0.2f, 0, 0));

        var answer = Ranker().Rank([query], top: 5);

        Assert.Equal(["A", "B", "C"], answer.Ranking.Select(r => r.Sku));
        var a = answer.Ranking[0];
        Assert.Equal(Distance(query.Crops[0], a1), a.Distance, 6);
        Assert.Equal("A/front.jpg", a.BestPhoto);
        Assert.Equal((2, 2), (a.PhotosMatched, a.PhotosInSku)); // side.jpg is 0.17 away: within 0.30 too
        Assert.Equal(Verdict.SamePhoto, a.Verdict);
        Assert.Equal(VerdictRule.Margin(a.Distance, answer.Ranking[1].Distance), a.Margin, 6);
    }

    [Fact]
    public void Only_the_first_row_can_be_sure_the_others_are_unsure_or_no_match()
    {
        var answer = Ranker().Rank([Photo("q", V(1, 0.3f, 0.3f, 0))], top: 5);

        Assert.Equal(Verdict.SamePart, answer.Verdict);
        Assert.Equal(Verdict.Unsure, answer.Ranking[1].Verdict);
        Assert.Equal(Verdict.NoMatch, answer.Ranking[2].Verdict);
        Assert.True(answer.Ranking.Skip(1).All(r => r.Margin < 0));
    }

    [Fact]
    public void Two_SKUs_about_equally_near_make_the_answer_unsure()
    {
        var answer = Ranker().Rank([Photo("q", V(1, 0.5f, 0.5f, 0))], top: 5);

        Assert.Equal(Verdict.Unsure, answer.Verdict);
        Assert.True(answer.Ranking[0].Margin < Thresholds.MinMargin);
    }

    [Fact]
    public void Identical_bytes_rank_first_as_the_same_file_at_distance_0_whatever_the_vectors_say()
    {
        var answer = Ranker().Rank([Photo("q", V(1, 0, 0, 0), sha256: "c-bytes")], top: 5);

        var first = answer.Ranking[0];
        Assert.Equal(("C", Verdict.SameFile, 0f, "C/front.jpg"), (first.Sku, first.Verdict, first.Distance, first.BestPhoto));
        Assert.Equal("A", answer.Ranking[1].Sku);
    }

    [Fact]
    public void Excluded_photos_are_never_returned_and_do_not_count()
    {
        var answer = Ranker().Rank([Photo("q", V(1, 0, 0, 0))], top: 5, exclude: new HashSet<int> { a1, c1 });

        Assert.Equal(["A", "B"], answer.Ranking.Select(r => r.Sku));
        Assert.Equal(("A/side.jpg", 1), (answer.Ranking[0].BestPhoto, answer.Ranking[0].PhotosInSku));
    }

    [Fact]
    public void Several_photos_are_fused_by_each_SKUs_nearest_photo_over_all_of_them()
    {
        var nearA = Photo("1", V(1, 0.2f, 0, 0));
        var nearC = Photo("2", V(0, 0, 0.1f, 1));

        var fused = Ranker().Rank([nearA, nearC], top: 5);

        Assert.Equal(["1", "2"], fused.Photos);
        foreach (var row in fused.Ranking)
        {
            var single = new[] { nearA, nearC }.Select(p => Ranker().Rank([p], top: 5).Ranking.Single(r => r.Sku == row.Sku).Distance).Min();
            Assert.Equal(single, row.Distance, 6);
        }
    }

    [Fact]
    public void The_best_crop_decides_the_score_but_only_the_whole_photo_can_make_it_the_same_photo()
    {
        var query = new QueryPhoto("q", [Unit(V(0, 1, 1, 1)), Unit(V(1, 0, 0, 0))], null, 0);

        var first = Ranker().Rank([query], top: 5).Ranking[0];

        Assert.Equal(("A", 0f), (first.Sku, MathF.Round(first.Distance, 5)));
        Assert.True(first.WholePhotoDistance > Thresholds.Copy);
        Assert.Equal(Verdict.SamePart, first.Verdict);
    }

    [Fact]
    public void Top_limits_the_rows()
    {
        Assert.Single(Ranker().Rank([Photo("q", V(1, 0, 0, 0))], top: 1).Ranking);
    }

    [Fact]
    public void Every_crop_of_every_photo_is_searched()
    {
        var query = new QueryPhoto("q", [Unit(V(1, 0, 0, 0)), Unit(V(0, 1, 0, 0)), Unit(V(0, 0, 1, 0))], null, null);

        Ranker().Rank([query, Photo("r", V(0, 0, 0, 1))], top: 2);

        Assert.Equal(4, catalogue.Searches);
    }

    private SkuRanker Ranker() => new(catalogue, Thresholds, new RankingOptions { Workers = 1 });

    private static float[] V(params float[] values) => values;

    private static float[] Unit(float[] v)
    {
        var unit = new float[v.Length];
        CosineKernel.Normalize(v, unit);
        return unit;
    }

    private static QueryPhoto Photo(string label, float[] vector, string? sha256 = null) =>
        new(label, [Unit(vector)], sha256, 0);

    private float Distance(float[] query, int node) => CosineKernel.Distance(query, catalogue.Vector(node));
}

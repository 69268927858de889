using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class SweepEngineTests
{
    private static readonly DateTimeOffset Noon = new(2026, 3, 1, 12, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Run_finds_exactly_the_planted_answers_in_order_of_severity()
    {
        var photos = SyntheticCatalogue.Build();

        var report = SweepEngine.Run(photos, new ExactNeighbourSource(photos));

        var found = report.Findings.Select(f => (f.Kind, Describe(f))).ToList();
        Assert.Equal(
            [
                (FindingKind.SamePhotoSeveralSkus, "A/a1.png A/a2.png B/b1.png"),
                (FindingKind.CopiesInOneSku, "E/e1.png E/e2.png"),
                (FindingKind.LookAlikesAcrossSkus, "A/a3.png B/b1.png"),
                (FindingKind.LookAlikesAcrossSkus, "C/c1.png D/d1.png"),
                (FindingKind.FarFromItsSku, "F/f4.png, nearer to G"),
            ],
            found.OrderBy(f => f.Item1).ThenBy(f => f.Item2, StringComparer.Ordinal));
        Assert.Equal(report.Findings.OrderBy(f => f.Kind).Select(f => f.Kind), report.Findings.Select(f => f.Kind));
    }

    [Fact]
    public void Run_names_the_relation_of_each_pair_in_the_same_photo_group()
    {
        var photos = SyntheticCatalogue.Build();
        var id = photos.ToDictionary(p => p.Path, p => p.Id);

        var group = SweepEngine.Run(photos, new ExactNeighbourSource(photos)).Findings.Single(f => f.Kind == FindingKind.SamePhotoSeveralSkus);

        var a1b1 = group.Pairs.Single(p => new[] { p.FirstPhotoId, p.SecondPhotoId }.Order().SequenceEqual(new[] { id["A/a1.png"], id["B/b1.png"] }.Order()));
        Assert.Equal(PairRelation.IdenticalBytes, a1b1.Relation);
        Assert.All(group.Pairs.Where(p => p != a1b1), p => Assert.Equal(PairRelation.Copy, p.Relation));
        Assert.All(group.Pairs.Where(p => p != a1b1), p => Assert.Equal(CopyEdits.Resized, p.Evidence.Edits));
    }

    [Fact]
    public void Run_examines_each_pair_once_and_counts_what_it_saw()
    {
        var photos = SyntheticCatalogue.Build();

        var counts = SweepEngine.Run(photos, new ExactNeighbourSource(photos)).Counts;

        Assert.Equal(photos.Count, counts.Photos);
        Assert.Equal(8, counts.Skus);
        Assert.Equal(1, counts.IdenticalPairs);
        Assert.Equal(1, counts.SamePixelPairs);
        Assert.Equal(2, counts.CopyPairs);
        Assert.Equal(2, counts.LookAlikePairs);
        Assert.Equal(0, counts.PairsWithoutThumbnails);
        Assert.True(counts.OtherViewPairs >= 4, $"other views {counts.OtherViewPairs}");

        // Every unordered pair within the radius, by brute force over all pairs.
        var expected = 0;
        for (var i = 0; i < photos.Count; i++)
        {
            for (var j = i + 1; j < photos.Count; j++)
            {
                var dot = photos[i].Embedding.Span.ToArray().Zip(photos[j].Embedding.ToArray(), (x, y) => x * y).Sum();
                expected += 1 - dot <= new SweepOptions().SearchRadius ? 1 : 0;
            }
        }

        Assert.Equal(expected, counts.PairsExamined);
    }

    [Fact]
    public void Run_keeps_a_pair_that_the_source_finds_from_one_side_only()
    {
        var photos = SyntheticCatalogue.Build();
        var exact = SweepEngine.Run(photos, new ExactNeighbourSource(photos));

        var oneSided = SweepEngine.Run(photos, new OneSidedSource(photos));

        Assert.Equal(exact.Counts.PairsExamined, oneSided.Counts.PairsExamined);
        Assert.Equal(exact.Findings.Select(f => f.Key), oneSided.Findings.Select(f => f.Key));
    }

    [Fact]
    public void Run_gives_the_same_report_on_one_thread_and_on_many()
    {
        var photos = SyntheticCatalogue.Build();
        var clock = new FixedClock(Noon);

        var one = SweepEngine.Run(photos, new ExactNeighbourSource(photos), new SweepOptions { MaxDegreeOfParallelism = 1 }, clock: clock);
        var many = SweepEngine.Run(photos, new ExactNeighbourSource(photos), new SweepOptions { MaxDegreeOfParallelism = 4 }, clock: clock);

        Assert.Equal(
            SweepJsonWriter.ToJson(one with { Settings = new SweepOptions() }),
            SweepJsonWriter.ToJson(many with { Settings = new SweepOptions() }));
    }

    [Fact]
    public void Run_asks_the_thumbnail_source_only_for_photos_without_a_stored_thumbnail()
    {
        var photos = SyntheticCatalogue.Build();
        var stored = photos.ToDictionary(p => p.Id, p => p.Thumbnail);
        var withoutE = photos.Select(p => p.Sku == "E" ? p with { Thumbnail = null } : p).ToList();
        var asked = new List<string>();

        var report = SweepEngine.Run(withoutE, new ExactNeighbourSource(withoutE), thumbnails: p =>
        {
            lock (asked)
            {
                asked.Add(p.Path);
            }

            return stored[p.Id];
        });

        Assert.Equal(["E/e1.png", "E/e2.png"], asked.Order(StringComparer.Ordinal));
        Assert.Equal(0, report.Counts.PairsWithoutThumbnails);
    }

    [Fact]
    public void Run_rejects_duplicate_ids_and_names_both_files()
    {
        var photos = SyntheticCatalogue.Build();
        photos[1] = photos[1] with { Id = photos[0].Id };

        var error = Assert.Throws<ArgumentException>(() => SweepEngine.Run(photos, new ExactNeighbourSource(photos.Take(1).ToList())));

        Assert.Contains(photos[0].Path, error.Message, StringComparison.Ordinal);
        Assert.Contains(photos[1].Path, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_rejects_an_embedding_that_is_not_unit_length_and_says_so()
    {
        var photos = SyntheticCatalogue.Build();
        photos[2] = photos[2] with { Embedding = photos[2].Embedding.ToArray().Select(x => x * 2).ToArray() };

        var error = Assert.Throws<ArgumentException>(() => SweepEngine.Run(photos, new ExactNeighbourSource(photos)));

        Assert.Contains(photos[2].Path, error.Message, StringComparison.Ordinal);
        Assert.Contains("L2-normalised", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_of_an_empty_catalogue_is_an_empty_report()
    {
        var report = SweepEngine.Run([], new ExactNeighbourSource([]));

        Assert.Empty(report.Findings);
        Assert.Equal(0, report.Counts.Photos);
    }

    private static string Describe(SweepFinding f) => f.Outlier is { } o
        ? $"{f.Members.Single(m => m.Role == MemberRole.Flagged).Path}, nearer to {o.NearestOtherSku}"
        : string.Join(" ", SyntheticCatalogue.Paths(f));

    /// <summary>Reports a neighbour only to the photo with the smaller id, as an approximate graph search might.</summary>
    private sealed class OneSidedSource(IReadOnlyList<SweepPhoto> photos) : INeighbourSource
    {
        private readonly ExactNeighbourSource _exact = new(photos);

        public void FindWithin(int photoId, float radius, List<SweepNeighbour> results)
        {
            var all = new List<SweepNeighbour>();
            _exact.FindWithin(photoId, radius, all);
            results.AddRange(all.Where(n => n.PhotoId > photoId));
        }
    }

    private sealed class FixedClock(DateTimeOffset now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => now;
    }
}

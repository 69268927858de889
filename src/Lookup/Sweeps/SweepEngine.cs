namespace Lookup.Sweeps;

/// <summary>
/// The nightly sweep: every photo's neighbours within the widest reporting distance, each pair classified (cheapest
/// evidence first), pairs grouped into findings, photos far from their SKU flagged.
/// Cost for n photos with P pairs within the radius: n neighbour queries (the graph's range search; O(n²) in total
/// only with <see cref="ExactNeighbourSource"/>), O(P log P) to sort the pairs, O(P) classification whose costly part
/// (thumbnail crop search, ~0.1 ms a pair) runs only for pairs within <see cref="SweepOptions.CropMaxDistance"/> whose
/// whole frames do not match, O(P α(n)) grouping, and O(Σ k²) over SKUs of k ≤ 256 photos for outliers.
/// Thread-safe for concurrent runs; each run is parallel over <see cref="SweepOptions.MaxDegreeOfParallelism"/> threads.
/// </summary>
public static class SweepEngine
{
    /// <summary>Sweeps <paramref name="photos"/> and returns the report (unfiltered: see <see cref="SweepReport.Filtered"/>).</summary>
    /// <param name="photos">The live photos, ids unique, embeddings L2-normalised and of one length.</param>
    /// <param name="neighbours">Answers radius queries by photo id (the graph, or <see cref="ExactNeighbourSource"/>).</param>
    /// <param name="options">Thresholds; defaults when null.</param>
    /// <param name="thumbnails">Makes a thumbnail for a photo that has none stored; without it such pairs are judged
    /// by the dHash alone.</param>
    /// <param name="finishes">Measures the finish of a photo's part for the finish check of <see cref="SkuOutliers"/>;
    /// without it only distances flag a photo filed under the wrong SKU.</param>
    /// <param name="clock">The clock for the report's times; the system clock when null.</param>
    /// <param name="cancellationToken">Stops the sweep between pairs.</param>
    public static SweepReport Run(
        IReadOnlyList<SweepPhoto> photos,
        INeighbourSource neighbours,
        SweepOptions? options = null,
        ThumbnailSource? thumbnails = null,
        FinishSource? finishes = null,
        TimeProvider? clock = null,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(photos);
        ArgumentNullException.ThrowIfNull(neighbours);
        options ??= new SweepOptions();
        options.Validate();
        clock ??= TimeProvider.System;
        var started = clock.GetUtcNow();
        var indexOfId = SweepInput.Check(photos);
        var parallel = new ParallelOptions
        {
            MaxDegreeOfParallelism = options.MaxDegreeOfParallelism == 0 ? Environment.ProcessorCount : options.MaxDegreeOfParallelism,
            CancellationToken = cancellationToken,
        };

        var pairs = PairCollector.Collect(photos, indexOfId, neighbours, options.SearchRadius, parallel);
        var (relations, evidence, withoutThumbnails) =
            PairClassification.Run(photos, pairs, new ThumbnailCache(photos, thumbnails), options, parallel);

        var members = photos.Select(p => FindingMember.Of(p)).ToList();
        var samePhoto = new List<FindingPair>();
        var lookAlike = new List<FindingPair>();
        long otherViews = 0;
        for (var k = 0; k < pairs.Length; k++)
        {
            var (a, b) = (photos[pairs[k].First], photos[pairs[k].Second]);
            var pair = new FindingPair(a.Id, b.Id, relations[k], evidence[k], FindingKeys.Pair(a.Sha256, b.Sha256));
            if (relations[k] >= PairRelation.Copy)
            {
                samePhoto.Add(pair);
            }
            else if (relations[k] == PairRelation.LookAlike)
            {
                lookAlike.Add(pair);
            }
            else if (evidence[k].Distance <= options.LookAlikeMaxDistance && string.Equals(a.Sku, b.Sku, StringComparison.Ordinal))
            {
                otherViews++;
            }
        }

        var findings = FindingBuilder.Partition(true, members, samePhoto);
        findings.AddRange(FindingBuilder.Partition(false, members, lookAlike));
        FinishSignature?[]? finish = null;
        if (finishes is not null)
        {
            finish = new FinishSignature?[photos.Count];
            Parallel.For(0, photos.Count, parallel, i => finish[i] = finishes(photos[i]));
        }

        findings.AddRange(SkuOutliers.Find(photos, indexOfId, neighbours, options, parallel, finish));

        var counts = new SweepCounts
        {
            Photos = photos.Count,
            Skus = photos.Select(p => p.Sku).Distinct(StringComparer.Ordinal).Count(),
            PairsExamined = pairs.Length,
            IdenticalPairs = relations.LongCount(r => r == PairRelation.IdenticalBytes),
            SamePixelPairs = relations.LongCount(r => r == PairRelation.SamePixels),
            CopyPairs = relations.LongCount(r => r == PairRelation.Copy),
            LookAlikePairs = lookAlike.Count,
            OtherViewPairs = otherViews,
            PairsWithoutThumbnails = withoutThumbnails,
        };
        return new SweepReport(options, started, clock.GetUtcNow(), counts, FindingOrder.Sort(findings));
    }
}

using System.Collections.Concurrent;
using Lookup.Store;

namespace Lookup.Matching;

/// <summary>
/// Folds photo hits into a SKU ranking. Each crop of each query photo asks the graph for its nearest photos; the
/// SKUs met that way with the nearest hits (and any SKU holding a byte-identical file) are scored exactly against
/// all of their photos' stored vectors. A SKU's score is its nearest photo's distance over every crop of every
/// query photo: several photos of one part are fused by taking the minimum, so one good view is enough (measured
/// against the mean of each photo's best distance in DEVELOPERS.md, section Matching: never worse, often better).
/// Rescoring all photos of a candidate makes its score and its count of matching photos independent of which
/// photos the approximate search happened to return. Photos without a SKU are never indexed by ingest and are
/// skipped here.
/// Thread safety: one ranking at a time per instance; the catalogue is read concurrently.
/// </summary>
internal sealed partial class SkuRanker(IMatchCatalogue catalogue, VerdictThresholds thresholds, RankingOptions options)
{
    private static readonly IReadOnlySet<int> Nothing = new HashSet<int>();

    /// <summary>The <paramref name="top"/> nearest SKUs to the query photos, fused into one ranking.</summary>
    /// <param name="photos">One or more photos of one part.</param>
    /// <param name="top">Rows wanted.</param>
    /// <param name="exclude">Graph nodes never to return (a stored photo queried by itself).</param>
    public MatchAnswer Rank(IReadOnlyList<QueryPhoto> photos, int top, IReadOnlySet<int>? exclude = null)
    {
        ArgumentOutOfRangeException.ThrowIfZero(photos.Count);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(top);
        exclude ??= Nothing;
        var hits = SearchAll(photos, options.HitsPerCrop(top), options.SkusScored(top), exclude);
        var identical = IdenticalFiles(photos, exclude);
        var skus = hits.Keys.Union(identical.Keys, StringComparer.Ordinal).ToArray();
        var scores = new SkuScore?[skus.Length];
        Parallel.For(0, skus.Length, Parallelism(), i =>
        {
            var sku = skus[i];
            scores[i] = Score(sku, photos, hits.GetValueOrDefault(sku), identical.GetValueOrDefault(sku), exclude);
        });

        var ranked = scores.OfType<SkuScore>()
            .OrderBy(s => s.Distance)
            .ThenBy(s => s.IdenticalFile ? 0 : 1)
            .ThenBy(s => s.Sku, StringComparer.Ordinal)
            .ToList();
        return new MatchAnswer([.. photos.Select(p => p.Label)], [.. ranked.Take(top).Select((s, i) => ToRow(s, i, ranked))]);
    }

    private SkuMatch ToRow(SkuScore score, int index, List<SkuScore> ranked)
    {
        float? nearestOther = index > 0 ? ranked[0].Distance : ranked.Count > 1 ? ranked[1].Distance : null;
        float margin = VerdictRule.Margin(score.Distance, nearestOther);
        var verdict = VerdictRule.Decide(score.IdenticalFile, score.Distance, margin, score.WholePhotoDistance, score.HashBits, thresholds);
        return new SkuMatch(index + 1, score.Sku, score.Distance, score.WholePhotoDistance, margin, verdict, score.PhotosMatched, score.PhotosInSku, score.BestPhoto.Path);
    }

    /// <summary>
    /// The SKUs of the nearest photos over every crop, nearest first, until <paramref name="skus"/> SKUs are known:
    /// photo records are looked up one by one (one index read each on a large catalogue), so nodes beyond those are
    /// left alone; SKUs first met there could not rank among the ones scored.
    /// </summary>
    private Dictionary<string, HashSet<int>> SearchAll(IReadOnlyList<QueryPhoto> photos, int k, int skus, IReadOnlySet<int> exclude)
    {
        var vectors = photos.SelectMany(p => p.Crops).ToArray();
        var found = new ConcurrentDictionary<int, float>();
        Parallel.For(0, vectors.Length, Parallelism(), i =>
        {
            foreach (var hit in catalogue.Nearest(vectors[i], k + exclude.Count))
            {
                if (!exclude.Contains(hit.Id))
                {
                    found.AddOrUpdate(hit.Id, hit.Distance, (_, d) => Math.Min(d, hit.Distance));
                }
            }
        });

        var bySku = new Dictionary<string, HashSet<int>>(StringComparer.Ordinal);
        foreach (int node in found.OrderBy(f => f.Value).ThenBy(f => f.Key).Select(f => f.Key))
        {
            if (catalogue.PhotoAt(node) is { Sku: { } sku })
            {
                if (!bySku.TryGetValue(sku, out var nodes))
                {
                    if (bySku.Count == skus)
                    {
                        break;
                    }

                    bySku[sku] = nodes = [];
                }

                nodes.Add(node);
            }
        }

        return bySku;
    }

    /// <summary>Catalogue photos whose bytes equal a query photo's, one per SKU.</summary>
    private Dictionary<string, PhotoRecord> IdenticalFiles(IReadOnlyList<QueryPhoto> photos, IReadOnlySet<int> exclude)
    {
        var identical = new Dictionary<string, PhotoRecord>(StringComparer.Ordinal);
        foreach (var sha in photos.Select(p => p.Sha256).OfType<string>().Distinct(StringComparer.Ordinal))
        {
            foreach (var record in catalogue.PhotosWithContent(sha).Where(r => r.Sku is not null && !exclude.Contains(r.NodeId!.Value)).OrderBy(r => r.Path, StringComparer.Ordinal))
            {
                identical.TryAdd(record.Sku!, record);
            }
        }

        return identical;
    }

    private ParallelOptions Parallelism() => new() { MaxDegreeOfParallelism = Math.Max(1, options.Workers) };
}

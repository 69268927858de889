using System.Collections.Concurrent;
using Lookup.Embedding;
using Lookup.Imaging;

namespace Lookup.Matching;

/// <summary>
/// The engine entry point of <c>lookup match</c>: photos (or stored vectors) in, SKU rankings with verdicts out.
/// Query photos are read, hashed and decoded before the network is asked for, so a caller can load the model on
/// another thread meanwhile; a photo that cannot be used becomes a <see cref="QueryFailure"/> and the others are
/// still answered. Thread safety: one run at a time.
/// </summary>
internal sealed class PartMatcher(MatchIndex index, PhotoDecoder decoder, RankingOptions? ranking = null)
{
    private readonly RankingOptions _ranking = ranking ?? new RankingOptions();

    /// <summary>Matches photo files.</summary>
    /// <param name="paths">The query photos.</param>
    /// <param name="request">Rows, crops, fused or each, workers.</param>
    /// <param name="model">Returns the embedder (blocking until it is loaded); called only if a photo could be read.</param>
    /// <exception cref="Store.IndexFileException">The model differs from the index's (<see cref="MatchIndex.RequireModel"/>).</exception>
    /// <exception cref="ModelLoadException">Thrown by <paramref name="model"/>.</exception>
    public MatchRun MatchFiles(IReadOnlyList<string> paths, MatchRequest request, Func<ImageEmbedder> model)
    {
        ArgumentNullException.ThrowIfNull(paths);
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(model);
        var prepared = new PreparedQuery?[paths.Count];
        var failures = new ConcurrentDictionary<int, QueryFailure>();
        var reader = new QueryReader(decoder);
        try
        {
            Parallel.For(0, paths.Count, new ParallelOptions { MaxDegreeOfParallelism = request.Workers }, i =>
            {
                try
                {
                    prepared[i] = reader.Read(paths[i], request.Crops);
                }
                catch (PhotoRejectedException e)
                {
                    failures[i] = new QueryFailure(paths[i], e.Reason.Code(), e.Message);
                }
            });

            var ready = prepared.OfType<PreparedQuery>().ToList();
            var answers = new List<MatchAnswer>();
            if (ready.Count > 0)
            {
                var embedder = model();
                index.RequireModel(embedder);
                var photos = CropEmbedding.Embed(ready, embedder, request.Workers);
                answers.AddRange(Rank(photos, request));
            }

            return new MatchRun(answers, [.. failures.OrderBy(f => f.Key).Select(f => f.Value)]);
        }
        finally
        {
            foreach (var query in prepared)
            {
                query?.Dispose();
            }
        }
    }

    /// <summary>Matches stored vectors (<see cref="LikeQuery"/>): always one fused ranking, the query's own photos excluded.</summary>
    public MatchRun MatchLike(LikeQuery query, MatchRequest request)
    {
        ArgumentNullException.ThrowIfNull(query);
        ArgumentNullException.ThrowIfNull(request);
        var answer = Ranker(request).Rank(query.Photos, request.Top, query.Exclude);
        return new MatchRun([answer with { Photos = [query.Description] }], []);
    }

    private IEnumerable<MatchAnswer> Rank(IReadOnlyList<QueryPhoto> photos, MatchRequest request)
    {
        var ranker = Ranker(request);
        return request.Each
            ? photos.Select(p => ranker.Rank([p], request.Top))
            : [ranker.Rank(photos, request.Top)];
    }

    private SkuRanker Ranker(MatchRequest request) =>
        new(index, index.Thresholds, _ranking with { Workers = request.Workers });
}

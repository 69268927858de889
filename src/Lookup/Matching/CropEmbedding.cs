using Lookup.Embedding;

namespace Lookup.Matching;

/// <summary>
/// Embeds every region of every prepared query through one shared network session, one worker per core: the
/// regions of all photos form one work list, so two photos of six crops keep two cores as busy as one of twelve.
/// </summary>
internal static class CropEmbedding
{
    public static QueryPhoto[] Embed(IReadOnlyList<PreparedQuery> queries, ImageEmbedder embedder, int workers)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(workers);
        var work = queries.SelectMany((q, i) => q.Regions.Select((_, r) => (Query: i, Region: r))).ToArray();
        var vectors = queries.Select(q => new float[q.Regions.Length][]).ToArray();
        Parallel.For(0, work.Length, new ParallelOptions { MaxDegreeOfParallelism = workers }, w =>
        {
            var (q, r) = work[w];
            var embedding = new float[embedder.Dimension];
            embedder.Embed(queries[q].Photo.Image, queries[q].Regions[r], embedding);
            vectors[q][r] = embedding;
        });
        return [.. queries.Select((q, i) => new QueryPhoto(q.Path, vectors[i], q.Sha256, q.DifferenceHash))];
    }
}

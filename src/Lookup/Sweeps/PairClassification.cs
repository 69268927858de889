using System.Numerics.Tensors;

namespace Lookup.Sweeps;

/// <summary>
/// Classifies every pair in parallel, one <see cref="PairClassifier"/> (with its scratch buffers) per thread. The
/// distance is recomputed from the embeddings so both sides of a pair agree whatever the neighbour source said.
/// </summary>
internal static class PairClassification
{
    public static (PairRelation[] Relations, PairEvidence[] Evidence, long WithoutThumbnails) Run(
        IReadOnlyList<SweepPhoto> photos,
        PhotoPair[] pairs,
        ThumbnailCache thumbnails,
        SweepOptions options,
        ParallelOptions parallel)
    {
        var relations = new PairRelation[pairs.Length];
        var evidence = new PairEvidence[pairs.Length];
        long withoutThumbnails = 0;
        Parallel.For(
            0,
            pairs.Length,
            parallel,
            () => (Classifier: new PairClassifier(options), Missing: 0L),
            (k, _, local) =>
            {
                var (a, b) = (photos[pairs[k].First], photos[pairs[k].Second]);
                var distance = Math.Max(0f, 1f - TensorPrimitives.Dot(a.Embedding.Span, b.Embedding.Span));
                if (distance > options.SearchRadius)
                {
                    evidence[k] = new PairEvidence(distance, 0, 0, null, AlignmentHypothesis.FullFrame, CopyEdits.None);
                    return local;
                }

                GreyThumbnail? thumbA = null, thumbB = null;
                if (distance <= options.CopyMaxDistance)
                {
                    (thumbA, thumbB) = (thumbnails.Get(pairs[k].First), thumbnails.Get(pairs[k].Second));
                    if (thumbA is null || thumbB is null)
                    {
                        local.Missing++;
                    }
                }

                (relations[k], evidence[k]) = local.Classifier.Classify(a, thumbA, b, thumbB, distance);
                return local;
            },
            local => Interlocked.Add(ref withoutThumbnails, local.Missing));
        return (relations, evidence, withoutThumbnails);
    }
}

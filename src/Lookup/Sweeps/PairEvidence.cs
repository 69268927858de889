namespace Lookup.Sweeps;

/// <summary>
/// What was measured on a pair, cheapest first; later fields stay at their "not measured" values when an earlier
/// one decided.
/// </summary>
/// <param name="Distance">Cosine distance of the embeddings.</param>
/// <param name="HashDistance">dHash Hamming distance (0–64).</param>
/// <param name="MirroredHashDistance">Hamming distance to the other photo's mirrored dHash.</param>
/// <param name="Correlation">Best thumbnail correlation found (null when no thumbnails were compared).</param>
/// <param name="Alignment">The placement that gave <paramref name="Correlation"/>.</param>
/// <param name="Edits">For a copy, the edits the evidence shows.</param>
public readonly record struct PairEvidence(
    float Distance,
    int HashDistance,
    int MirroredHashDistance,
    float? Correlation,
    AlignmentHypothesis Alignment,
    CopyEdits Edits);

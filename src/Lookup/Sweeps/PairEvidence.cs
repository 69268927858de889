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
/// <param name="DetailCorrelation">Gradient correlation of the 64 × 64 detail thumbnails at <paramref name="Alignment"/>
/// (null when not measured: the 32 × 32 thumbnails already said no, or a photo has no detail thumbnail).</param>
/// <param name="ColourSpread">The larger colour spread of the two photos over the aligned region, in levels (null when
/// not measured).</param>
/// <param name="ColourSpreadRatio">The smaller colour spread over the larger (null when not measured).</param>
/// <param name="ColourCorrelation">Correlation of their colour patterns (null when not measured).</param>
public readonly record struct PairEvidence(
    float Distance,
    int HashDistance,
    int MirroredHashDistance,
    float? Correlation,
    AlignmentHypothesis Alignment,
    CopyEdits Edits,
    float? DetailCorrelation = null,
    float? ColourSpread = null,
    float? ColourSpreadRatio = null,
    float? ColourCorrelation = null);

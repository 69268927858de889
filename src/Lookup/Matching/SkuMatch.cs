namespace Lookup.Matching;

/// <summary>One row of a ranking: a SKU, how close the query came to it and what that means.</summary>
/// <param name="Rank">1 for the nearest SKU.</param>
/// <param name="Sku">The SKU.</param>
/// <param name="Distance">The SKU's score: cosine distance of its nearest photo over the query's crops (fused over
/// several query photos); 0 for an identical file.</param>
/// <param name="WholePhotoDistance">The same without crops: whole query photo to the SKU's nearest photo.</param>
/// <param name="Margin">(d₂ − d₁) / d₂ against the nearest other SKU; negative below the first row.</param>
/// <param name="Verdict">What the distance and margin mean.</param>
/// <param name="PhotosMatched">How many of the SKU's photos lie within the same-part distance of the query.</param>
/// <param name="PhotosInSku">How many indexed photos the SKU has.</param>
/// <param name="BestPhoto">The nearest catalogue photo of the SKU (path relative to the catalogue root).</param>
public sealed record SkuMatch(
    int Rank,
    string Sku,
    float Distance,
    float WholePhotoDistance,
    float Margin,
    Verdict Verdict,
    int PhotosMatched,
    int PhotosInSku,
    string BestPhoto);

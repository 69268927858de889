using Lookup.Store;

namespace Lookup.Matching;

/// <summary>A candidate SKU's evidence before ranking: fused distance, whole-photo distance and hash bits, best photo, counts.</summary>
internal sealed record SkuScore(
    string Sku,
    float Distance,
    float WholePhotoDistance,
    int? HashBits,
    bool IdenticalFile,
    PhotoRecord BestPhoto,
    int PhotosMatched,
    int PhotosInSku);

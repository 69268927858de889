namespace Lookup.Catalogue;

/// <summary>What the index remembers of one photo from the previous ingest: the planner's view of the past.</summary>
/// <param name="RelativePath">Path below the catalogue root with '/' separators, as <see cref="CatalogueEntry.RelativePath"/>.</param>
/// <param name="Size">Length in bytes when last seen.</param>
/// <param name="MtimeUtcTicks">Last write time (UTC ticks) when last seen.</param>
/// <param name="Sha256">Lower-case hex SHA-256 of the content, or null when it was never read successfully.</param>
/// <param name="Sku">The SKU it was filed under, or null.</param>
/// <param name="NodeId">Its graph node, or null when it has none (failed photos).</param>
/// <param name="Status">Whether it is indexed or recorded as failed.</param>
internal sealed record KnownPhoto(
    string RelativePath,
    long Size,
    long MtimeUtcTicks,
    string? Sha256,
    string? Sku,
    long? NodeId,
    KnownPhotoStatus Status);

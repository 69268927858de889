namespace Lookup.Catalogue;

/// <summary>One line of a <see cref="ChangePlan"/>.</summary>
/// <param name="Kind">What to do.</param>
/// <param name="RelativePath">The current path; for gone, missing and unverified photos the known path.</param>
/// <param name="Known">The index's record of this photo (for a move: the record at the old path), or null when new.</param>
/// <param name="Current">The scanned file with its SKU, or null when the file is not there.</param>
/// <param name="Sha256">The content hash: computed for hashed files, carried from the record otherwise; null for a
/// new file that could not be a move (the ingest hashes it) or a record that never had one.</param>
/// <param name="Error">Why hashing failed, for <see cref="ChangeKind.HashFailed"/>.</param>
internal sealed record PlannedChange(
    ChangeKind Kind,
    string RelativePath,
    KnownPhoto? Known,
    MappedEntry? Current,
    string? Sha256,
    string? Error = null)
{
    /// <summary>The SKU the photo should carry: the current mapping's, or the known one when the photo is unmapped now.</summary>
    public string? Sku => Current?.Sku ?? Known?.Sku;

    /// <summary>True when the current mapping gives a SKU that differs from the known one.</summary>
    public bool SkuDiffers =>
        Known is not null && Current?.Sku is not null && !string.Equals(Known.Sku, Current.Sku, StringComparison.Ordinal);

    /// <summary>True when the record's size or modification time must be updated.</summary>
    public bool MetadataDiffers =>
        Known is not null && Current is not null
        && (Known.Size != Current.Entry.Size || Known.MtimeUtcTicks != Current.Entry.MtimeUtcTicks);
}

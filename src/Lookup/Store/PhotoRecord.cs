namespace Lookup.Store;

/// <summary>
/// What the index knows about one catalogue photo: where it is, what it is filed under, how to tell whether it
/// changed, and the cheap evidence sweeps need without decoding it again.
/// </summary>
public sealed record PhotoRecord
{
    /// <summary>Path relative to the catalogue root, '/' separated; the record's key.</summary>
    public required string Path { get; init; }

    /// <summary>The SKU the photo is filed under; null when no mapping rule gave one.</summary>
    public string? Sku { get; init; }

    /// <summary>File size in bytes when last read.</summary>
    public long Size { get; init; }

    /// <summary>Last-write time, UTC ticks, when last read.</summary>
    public long MtimeUtcTicks { get; init; }

    /// <summary>Lower-case hex SHA-256 of the bytes; null for a file that could not be read.</summary>
    public string? Sha256 { get; init; }

    /// <summary>Indexed or failed.</summary>
    public PhotoStatus Status { get; init; }

    /// <summary>The graph node holding the embedding (indexed photos only).</summary>
    public int? NodeId { get; init; }

    /// <summary>Decoded width after EXIF orientation.</summary>
    public int Width { get; init; }

    /// <summary>Decoded height after EXIF orientation.</summary>
    public int Height { get; init; }

    /// <summary>Container format (JPEG, PNG, ...).</summary>
    public string? Format { get; init; }

    /// <summary>64-bit dHash of the decoded photo.</summary>
    public ulong DHash { get; init; }

    /// <summary>32 × 32 grey thumbnail (1,024 bytes) for the sweep's pixel evidence; null when not made.</summary>
    public byte[]? Thumbnail { get; init; }

    /// <summary>64 × 64 grey detail thumbnail (4,096 bytes) for the sweep's copy check; null in records written before
    /// it was stored (the next ingest adds it).</summary>
    public byte[]? Detail { get; init; }

    /// <summary>32 × 32 Cb and Cr planes (2,048 bytes) for the sweep's colour check; null in records written before it
    /// was stored (the next ingest adds it).</summary>
    public byte[]? Chroma { get; init; }

    /// <summary>Short machine-readable reason for a failure (e.g. TooManyPixels).</summary>
    public string? FailureReason { get; init; }

    /// <summary>The full failure message, naming the file and the fix.</summary>
    public string? FailureMessage { get; init; }

    /// <summary>When this record was last written.</summary>
    public DateTime UpdatedUtc { get; init; }
}

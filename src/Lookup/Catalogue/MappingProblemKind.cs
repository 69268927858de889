namespace Lookup.Catalogue;

/// <summary>What went wrong while giving photos their SKUs.</summary>
internal enum MappingProblemKind
{
    /// <summary>A scanned photo got no SKU (not in the CSV, no match for the pattern, no parent folder).</summary>
    Unmapped,

    /// <summary>A CSV row names a file that does not exist.</summary>
    RowFileMissing,

    /// <summary>A CSV row names a file that exists but was not scanned (hidden, not an image, outside the root).</summary>
    RowFileNotScanned,

    /// <summary>The same file is listed twice with the same SKU (warning).</summary>
    DuplicateRow,

    /// <summary>The same file is listed with different SKUs; the photo stays unmapped (error).</summary>
    ConflictingSku,

    /// <summary>A CSV row has an empty SKU.</summary>
    EmptySku,

    /// <summary>A CSV row that cannot be read (quoting, field count, empty file name).</summary>
    MalformedRow,
}

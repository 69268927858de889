namespace Lookup.Sweeps;

/// <summary>What the sweep concluded about two photos, weakest to strongest.</summary>
public enum PairRelation
{
    /// <summary>Different photos, nothing to report (e.g. two views of one part inside one SKU).</summary>
    None = 0,

    /// <summary>Different photos under different SKUs that look alike: possibly the same part.</summary>
    LookAlike = 1,

    /// <summary>The same photo, edited: re-encoded, resized, cropped, tone-changed, mirrored or slightly turned.</summary>
    Copy = 2,

    /// <summary>Different files with the same pixels (e.g. metadata changed or saved losslessly again).</summary>
    SamePixels = 3,

    /// <summary>Byte-for-byte the same file (equal SHA-256).</summary>
    IdenticalBytes = 4,
}

namespace Lookup.Catalogue;

/// <summary>Where a known photo stands in the index.</summary>
internal enum KnownPhotoStatus
{
    /// <summary>Embedded; it has a graph node.</summary>
    Indexed,

    /// <summary>Recorded with a failure reason; it has no graph node.</summary>
    Failed,
}

namespace Lookup.Catalogue;

/// <summary>One file found by <see cref="CatalogueScanner"/>.</summary>
/// <param name="FullPath">Absolute path as reached from the root (through any followed link, not resolved).</param>
/// <param name="RelativePath">Path below the scan root with '/' separators; the key a photo is known by.</param>
/// <param name="Size">Length in bytes (of the link's target when reached through a file link).</param>
/// <param name="MtimeUtcTicks">Last write time, UTC, in <see cref="DateTime.Ticks"/>.</param>
/// <param name="Format">The format recognised from the content; <see cref="ImageFormat.Unknown"/> when flagged.</param>
/// <param name="ContentProblem">Why a file with an image extension is not an image (null for images).</param>
/// <param name="ProblemReason">
/// The failure reason to record for a flagged entry when it is neither empty nor of an unknown format (a
/// <c>PhotoRejectionReason</c> name), or null.
/// </param>
internal sealed record CatalogueEntry(
    string FullPath,
    string RelativePath,
    long Size,
    long MtimeUtcTicks,
    ImageFormat Format,
    string? ContentProblem,
    string? ProblemReason = null)
{
    /// <summary>True when the content carries a recognised image signature.</summary>
    public bool IsImage => Format != ImageFormat.Unknown;
}

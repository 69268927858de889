namespace Lookup.Catalogue;

/// <summary>A path the scan could not take in as a catalogue entry, and why.</summary>
/// <param name="Kind">The kind of problem.</param>
/// <param name="FullPath">Absolute path as reached from the root.</param>
/// <param name="RelativePath">Path below the root with '/' separators ("" for the root itself).</param>
/// <param name="Message">A sentence naming the path, the cause and the fix.</param>
internal sealed record ScanProblem(ScanProblemKind Kind, string FullPath, string RelativePath, string Message)
{
    /// <summary>
    /// True when the path exists but could not be read, so known photos at or below it must not be treated as gone.
    /// </summary>
    public bool HidesContent => Kind is ScanProblemKind.AccessDenied or ScanProblemKind.ReadError or ScanProblemKind.TooDeep;
}

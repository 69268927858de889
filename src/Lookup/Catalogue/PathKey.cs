namespace Lookup.Catalogue;

/// <summary>How absolute paths compare on this platform: case-sensitive on Linux, case-insensitive elsewhere.</summary>
internal static class PathKey
{
    private static readonly bool IgnoreCase = OperatingSystem.IsWindows() || OperatingSystem.IsMacOS();

    /// <summary>The comparer for absolute paths on the running system.</summary>
    public static StringComparer Comparer { get; } = IgnoreCase ? StringComparer.OrdinalIgnoreCase : StringComparer.Ordinal;

    /// <summary>The same rule as a <see cref="StringComparison"/>.</summary>
    public static StringComparison Comparison { get; } = IgnoreCase ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;
}

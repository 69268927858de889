namespace Lookup.Tests.Imaging;

/// <summary>
/// Locates tests/reference-data (open photos from Debian packages; see its SOURCES.md) by walking up from the test
/// output folder to the repository root, so tests read the committed copies and never the network.
/// </summary>
internal static class ReferenceData
{
    private static readonly Lazy<string> RootDirectory = new(FindRoot);

    public static string Root => RootDirectory.Value;

    public static string OpenCv(string name) => Path.Combine(Root, "opencv", name);

    public static string SkImage(string name) => Path.Combine(Root, "skimage", name);

    public static string Generated(string name) => Path.Combine(Root, "generated", name);

    /// <summary>Every committed opencv-doc photo: the gallery for the pair checks.</summary>
    public static IReadOnlyList<string> OpenCvGallery() =>
        [.. Directory.GetFiles(Path.Combine(Root, "opencv")).Order(StringComparer.Ordinal)];

    private static string FindRoot()
    {
        for (var directory = new DirectoryInfo(AppContext.BaseDirectory); directory is not null; directory = directory.Parent)
        {
            var candidate = Path.Combine(directory.FullName, "tests", "reference-data");
            if (File.Exists(Path.Combine(candidate, "SOURCES.md")))
            {
                return candidate;
            }
        }

        throw new DirectoryNotFoundException($"tests/reference-data/SOURCES.md not found above {AppContext.BaseDirectory}; run the tests from a checkout of the repository.");
    }
}

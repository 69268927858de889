namespace Lookup.Demo;

/// <summary>
/// Finds the demo catalogue without being told where it is: a <c>demo-catalogue</c> folder holding
/// <c>truth.json</c> in one of the start folders or any folder above them (the repository root when run from a
/// clone, beside the program when installed).
/// </summary>
internal static class DemoFolderLocator
{
    /// <summary>The demo folder's name.</summary>
    public const string FolderName = "demo-catalogue";

    /// <summary>The first demo folder found walking up from each start folder in turn, or null.</summary>
    public static string? Find(IEnumerable<string> startFolders)
    {
        ArgumentNullException.ThrowIfNull(startFolders);
        foreach (var start in startFolders)
        {
            for (var folder = new DirectoryInfo(Path.GetFullPath(start)); folder is not null; folder = folder.Parent)
            {
                var candidate = Path.Combine(folder.FullName, FolderName);
                if (IsDemoFolder(candidate))
                {
                    return candidate;
                }
            }
        }

        return null;
    }

    /// <summary>True when <paramref name="folder"/> holds <c>truth.json</c> and the photos folder.</summary>
    public static bool IsDemoFolder(string folder) =>
        File.Exists(Path.Combine(folder, DemoTruth.FileName)) && Directory.Exists(Path.Combine(folder, DemoTruth.PhotosFolder));
}

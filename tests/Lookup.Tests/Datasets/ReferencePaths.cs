namespace Lookup.Tests.Datasets;

/// <summary>Finds tests/reference-data/ from the test binaries (walks up to the repository root).</summary>
internal static class ReferencePaths
{
    public static string Root
    {
        get
        {
            for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            {
                string candidate = Path.Combine(dir.FullName, "tests", "reference-data");
                if (Directory.Exists(candidate))
                {
                    return candidate;
                }
            }

            throw new DirectoryNotFoundException($"tests/reference-data not found above {AppContext.BaseDirectory}.");
        }
    }

    public static string FashionMnist(string file) => Path.Combine(Root, "fashion-mnist", file);
}

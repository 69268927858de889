namespace Lookup.Tests.Demo;

/// <summary>Finds the committed demo-catalogue folder by walking up from the test binaries to the solution.</summary>
internal static class DemoFolder
{
    public const int Seed = 2026;

    public static string Root
    {
        get
        {
            for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            {
                if (File.Exists(Path.Combine(dir.FullName, "Lookup.sln")))
                {
                    return Path.Combine(dir.FullName, "demo-catalogue");
                }
            }

            throw new DirectoryNotFoundException($"No Lookup.sln above {AppContext.BaseDirectory}; run the tests from the repository.");
        }
    }

    public static string PathOf(string relative) => Path.Combine(Root, relative.Replace('/', Path.DirectorySeparatorChar));
}

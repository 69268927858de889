using Lookup.Store;
using Lookup.Tests.Catalogue;

namespace Lookup.Tests.Cli;

/// <summary>
/// A photo tree of 12 open reference photos (tests/reference-data, see SOURCES.md) in 4 SKU folders, ingested once by
/// the real <c>lookup ingest</c>; tests work on copies of the index file.
/// </summary>
public sealed class IngestedTemplate : IDisposable
{
    public const int Photos = 12;

    private readonly IngestTree _tree = new();
    private readonly List<string> _copies = [];

    public IngestedTemplate()
    {
        for (int i = 0; i < Photos; i++)
        {
            string reference = IngestTree.Distinct[i];
            _tree.Add(PhotoPath(i), reference);
        }

        var (exitCode, _, error) = LookupProcess.Run(["ingest", _tree.Root, "--index", _tree.IndexPath, "--json", "--quiet", "--workers", "1"]);
        if (exitCode != 0)
        {
            throw new InvalidOperationException($"the template ingest exited {exitCode}: {error}");
        }
    }

    /// <summary>The photo tree.</summary>
    public string Root => _tree.Root;

    /// <summary>Relative path of photo <paramref name="i"/>.</summary>
    public static string PhotoPath(int i) => $"S-{i % 4}/{i:00}{Path.GetExtension(IngestTree.Distinct[i])}";

    /// <summary>Absolute path of photo <paramref name="i"/> in the tree.</summary>
    public string Photo(int i) => _tree.PathOf(PhotoPath(i));

    /// <summary>A path outside the tree for files a test makes.</summary>
    public string Outside(string name) => _tree.Outside(name);

    /// <summary>A fresh copy of the ingested index (data file and journal, if any) in its own folder.</summary>
    public string CopyOfIndex()
    {
        string folder = Path.Combine(Path.GetTempPath(), "lookup-tests-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        _copies.Add(folder);
        string copy = Path.Combine(folder, "parts.lookup");
        File.Copy(_tree.IndexPath, copy);
        string journal = IndexFile.JournalPathFor(_tree.IndexPath);
        if (File.Exists(journal))
        {
            File.Copy(journal, IndexFile.JournalPathFor(copy));
        }

        return copy;
    }

    public void Dispose()
    {
        foreach (string folder in _copies)
        {
            RestoreModes(folder);
            try
            {
                Directory.Delete(folder, recursive: true);
            }
            catch (IOException)
            {
                // Still open in a failed test; the system cleans its temp folder.
            }
        }

        _tree.Dispose();
    }

    private static void RestoreModes(string folder)
    {
        if (OperatingSystem.IsWindows() || !Directory.Exists(folder))
        {
            return;
        }

        File.SetUnixFileMode(folder, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
        foreach (string file in Directory.GetFiles(folder))
        {
            File.SetUnixFileMode(file, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        }
    }
}

namespace Lookup.Tests.Store;

/// <summary>A fresh directory for index files, deleted afterwards.</summary>
internal sealed class TempIndex : IDisposable
{
    public TempIndex()
    {
        Directory = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "lookup-tests-" + Guid.NewGuid().ToString("N"));
        System.IO.Directory.CreateDirectory(Directory);
        Path = System.IO.Path.Combine(Directory, "parts.lookup");
    }

    public string Directory { get; }

    public string Path { get; }

    public void Dispose()
    {
        try
        {
            System.IO.Directory.Delete(Directory, recursive: true);
        }
        catch (IOException)
        {
            // A file still open elsewhere in a failed test; the temp folder is cleaned by the system.
        }
    }
}

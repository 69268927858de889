using System.Runtime.Versioning;

namespace Lookup.Tests.Catalogue;

/// <summary>A real folder tree under the system temp folder, removed (permissions restored first) on dispose.</summary>
internal sealed class TempTree : IDisposable
{
    // A fixed, ordinary time so tests can assert exact modification ticks.
    public static readonly DateTime FixedTime = new(2024, 5, 17, 9, 30, 0, DateTimeKind.Utc);

    public TempTree()
    {
        Root = Path.Combine(Path.GetTempPath(), "lookup-tests-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Root);
    }

    public string Root { get; }

    public string PathOf(string relative) => Path.Combine(Root, relative);

    public string File(string relative, byte[] content, DateTime? modified = null)
    {
        var path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        System.IO.File.WriteAllBytes(path, content);
        System.IO.File.SetLastWriteTimeUtc(path, modified ?? FixedTime);
        return path;
    }

    public string Text(string relative, string content) => File(relative, System.Text.Encoding.UTF8.GetBytes(content));

    public string Folder(string relative) => Directory.CreateDirectory(PathOf(relative)).FullName;

    public string FolderLink(string relative, string target)
    {
        var path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        Directory.CreateSymbolicLink(path, target);
        return path;
    }

    public string FileLink(string relative, string target)
    {
        var path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        System.IO.File.CreateSymbolicLink(path, target);
        return path;
    }

    public void Dispose()
    {
        if (!OperatingSystem.IsWindows())
        {
            RestoreAccess(new DirectoryInfo(Root));
        }

        Directory.Delete(Root, recursive: true);
    }

    [UnsupportedOSPlatform("windows")]
    private static void RestoreAccess(DirectoryInfo folder)
    {
        folder.UnixFileMode = UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute;
        foreach (var child in folder.EnumerateFileSystemInfos())
        {
            if (child.LinkTarget is not null)
            {
                continue;
            }

            if (child is DirectoryInfo sub)
            {
                RestoreAccess(sub);
            }
            else
            {
                child.UnixFileMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
            }
        }
    }
}

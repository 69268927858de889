namespace Lookup.Catalogue;

/// <summary>
/// The two file-system calls the scanner makes that can fail for reasons outside its control. Tests replace
/// them to make a file vanish or refuse access at an exact moment; production uses <see cref="Default"/>.
/// </summary>
/// <param name="OpenRead">Opens a file for reading its first bytes.</param>
/// <param name="List">Lists the direct children of a folder.</param>
internal sealed record ScanIo(Func<string, Stream> OpenRead, Func<string, IEnumerable<FileSystemInfo>> List)
{
    private static readonly EnumerationOptions ListOptions = new()
    {
        RecurseSubdirectories = false,
        IgnoreInaccessible = false,
        AttributesToSkip = 0,
        ReturnSpecialDirectories = false,
    };

    /// <summary>The real file system.</summary>
    public static ScanIo Default { get; } = new(OpenFile, ListFolder);

    private static FileStream OpenFile(string path) =>
        new(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete, bufferSize: 0);

    private static IEnumerable<FileSystemInfo> ListFolder(string path) =>
        new DirectoryInfo(path).EnumerateFileSystemInfos("*", ListOptions);
}

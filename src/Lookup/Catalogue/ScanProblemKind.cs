namespace Lookup.Catalogue;

/// <summary>What went wrong at one path during a scan.</summary>
internal enum ScanProblemKind
{
    /// <summary>A file or folder could not be opened: permission denied. Known photos below it are not gone.</summary>
    AccessDenied,

    /// <summary>Another I/O error while listing a folder or reading a file. Known photos below it are not gone.</summary>
    ReadError,

    /// <summary>The file or folder was listed but had disappeared when it was opened.</summary>
    Vanished,

    /// <summary>A symbolic link whose target does not exist, or whose chain of links does not end.</summary>
    BrokenLink,

    /// <summary>A linked folder that was already scanned (a loop back to an ancestor, or a second way in).</summary>
    FolderAlreadyScanned,

    /// <summary>A folder named like a photo (for example "x.jpg/"); its contents are still scanned.</summary>
    FolderNamedLikeImage,

    /// <summary>Folders nested deeper than <see cref="ScanOptions.MaxDepth"/>; not entered.</summary>
    TooDeep,
}

namespace Lookup.Catalogue;

internal sealed partial class CatalogueScanner
{
    /// <summary>The state of one scan: what was found, what failed, which real folders were visited.</summary>
    private sealed partial class Walk(CatalogueScanner scanner, string fullRoot, CancellationToken cancellationToken)
    {
        private readonly List<CatalogueEntry> _entries = [];
        private readonly List<ScanProblem> _problems = [];
        private readonly Dictionary<string, string> _visited = new(PathKey.Comparer);
        private readonly Queue<PendingLink> _linkedFolders = new();
        private int _skippedNonImages;
        private int _skippedHidden;
        private int _skippedLinks;

        public void Run(string realRoot)
        {
            _visited[realRoot] = fullRoot;
            ScanFolder(fullRoot, "", realRoot, 0);
            while (_linkedFolders.TryDequeue(out var link))
            {
                EnterLinkedFolder(link);
            }
        }

        public CatalogueScan ToResult()
        {
            _entries.Sort((a, b) => string.CompareOrdinal(a.RelativePath, b.RelativePath));
            return new CatalogueScan(fullRoot, _entries, _problems, _skippedNonImages, _skippedHidden, _skippedLinks);
        }

        private void ScanFolder(string fullPath, string relativePath, string realPath, int depth)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var children = ListChildren(fullPath, relativePath);
            foreach (var child in children)
            {
                var childRelative = relativePath.Length == 0 ? child.Name : relativePath + "/" + child.Name;
                if ((int)child.Attributes == -1)
                {
                    // Listed but not found again by its name (.NET reports every attribute set, Hidden included).
                    TakeUnreachable(child, childRelative);
                }
                else if (IsHidden(child))
                {
                    _skippedHidden++;
                }
                else if (child.Attributes.HasFlag(FileAttributes.ReparsePoint) && child.LinkTarget is not null)
                {
                    TakeLink(child, childRelative, depth);
                }
                else if (child is DirectoryInfo)
                {
                    EnterFolder(child.FullName, childRelative, Path.Join(realPath, child.Name), depth + 1);
                }
                else
                {
                    TakeFile(child.FullName, childRelative, (FileInfo)child);
                }
            }
        }

        private List<FileSystemInfo> ListChildren(string fullPath, string relativePath)
        {
            try
            {
                var children = scanner._io.List(fullPath).ToList();
                children.Sort((a, b) => string.CompareOrdinal(a.Name, b.Name));
                return children;
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                Report(e, fullPath, relativePath, "folder");
                return [];
            }
        }

        private void EnterFolder(string fullPath, string relativePath, string realPath, int depth)
        {
            if (ImageSignature.HasImageExtension(fullPath))
            {
                Add(ScanProblemKind.FolderNamedLikeImage, fullPath, relativePath,
                    $"{fullPath} is a folder named like a photo; its contents are scanned, but rename it to avoid confusion.");
            }

            if (depth > scanner._options.MaxDepth)
            {
                Add(ScanProblemKind.TooDeep, fullPath, relativePath,
                    $"{fullPath} is {depth} folder levels below the root, more than the limit of {scanner._options.MaxDepth}; "
                    + "it was not scanned. Flatten the tree or scan that folder on its own.");
                return;
            }

            if (_visited.TryGetValue(realPath, out var firstSeenAs))
            {
                Add(ScanProblemKind.FolderAlreadyScanned, fullPath, relativePath, AlreadyScannedMessage(fullPath, realPath, firstSeenAs));
                return;
            }

            _visited[realPath] = fullPath;
            ScanFolder(fullPath, relativePath, realPath, depth);
        }

        private static bool IsHidden(FileSystemInfo info) =>
            info.Name.StartsWith('.') || info.Attributes.HasFlag(FileAttributes.Hidden);

        private static string AlreadyScannedMessage(string fullPath, string realPath, string firstSeenAs)
        {
            var parentReal = RealPath.Resolve(Path.GetDirectoryName(fullPath) ?? fullPath) ?? "";
            var loops = PathKey.Comparer.Equals(parentReal, realPath)
                || parentReal.StartsWith(Path.TrimEndingDirectorySeparator(realPath) + Path.DirectorySeparatorChar, PathKey.Comparison);
            return loops
                ? $"{fullPath} links back to {firstSeenAs}, a folder that contains it; the loop was not followed."
                : $"{fullPath} leads to {realPath}, already scanned as {firstSeenAs}; it was not scanned twice.";
        }

        private void Add(ScanProblemKind kind, string fullPath, string relativePath, string message) =>
            _problems.Add(new ScanProblem(kind, fullPath, relativePath, message));

        private void Report(Exception e, string fullPath, string relativePath, string what)
        {
            switch (e)
            {
                case UnauthorizedAccessException:
                    Add(ScanProblemKind.AccessDenied, fullPath, relativePath,
                        $"{fullPath}: permission denied reading this {what}; grant read access to the account running the scan.");
                    break;
                case FileNotFoundException or DirectoryNotFoundException:
                    Add(ScanProblemKind.Vanished, fullPath, relativePath,
                        $"{fullPath}: the {what} disappeared during the scan; run the scan again once the folder is stable.");
                    break;
                default:
                    Add(ScanProblemKind.ReadError, fullPath, relativePath,
                        $"{fullPath}: the {what} could not be read ({e.Message}); check the disk or network share.");
                    break;
            }
        }
    }
}

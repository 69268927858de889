namespace Lookup.Catalogue;

internal sealed partial class CatalogueScanner
{
    private sealed partial class Walk
    {
        /// <summary>A link to a folder, entered after every real folder has been scanned.</summary>
        private sealed record PendingLink(string FullPath, string RelativePath, int Depth);

        private void TakeLink(FileSystemInfo link, string relativePath, int depth)
        {
            if (!scanner._options.FollowLinks)
            {
                _skippedLinks++;
                return;
            }

            if (link is DirectoryInfo)
            {
                _linkedFolders.Enqueue(new PendingLink(link.FullName, relativePath, depth + 1));
                return;
            }

            var target = RealPath.Resolve(link.FullName);
            if (target is null)
            {
                AddBrokenLink(link.FullName, relativePath);
            }
            else if (Directory.Exists(target))
            {
                _linkedFolders.Enqueue(new PendingLink(link.FullName, relativePath, depth + 1));
            }
            else
            {
                // Size and time of a link itself are those of the link, not the photo: read the target's.
                TakeFile(link.FullName, relativePath, new FileInfo(target));
            }
        }

        private void EnterLinkedFolder(PendingLink link)
        {
            var target = RealPath.Resolve(link.FullPath);
            if (target is null || !Directory.Exists(target))
            {
                AddBrokenLink(link.FullPath, link.RelativePath);
                return;
            }

            EnterFolder(link.FullPath, link.RelativePath, target, link.Depth);
        }

        private void AddBrokenLink(string fullPath, string relativePath) =>
            Add(ScanProblemKind.BrokenLink, fullPath, relativePath,
                $"{fullPath} is a link whose target does not exist or whose links loop; fix or remove the link.");
    }
}

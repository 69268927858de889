namespace Lookup.Catalogue;

internal sealed partial class CatalogueScanner
{
    private sealed partial class Walk
    {
        private void TakeFile(string fullPath, string relativePath, FileInfo info)
        {
            long size;
            long mtime;
            try
            {
                size = info.Length;
                mtime = info.LastWriteTimeUtc.Ticks;
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                Report(e, fullPath, relativePath, "file");
                return;
            }

            var hasImageName = ImageSignature.HasImageExtension(fullPath);
            if (size == 0)
            {
                Keep(fullPath, relativePath, size, mtime, ImageFormat.Unknown, hasImageName,
                    "the file is empty (0 bytes); replace it with the photo or delete it");
                return;
            }

            Span<byte> header = stackalloc byte[ImageSignature.HeaderLength];
            int read;
            try
            {
                using var stream = scanner._io.OpenRead(fullPath);
                read = stream.ReadAtLeast(header, header.Length, throwOnEndOfStream: false);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                Report(e, fullPath, relativePath, "file");
                return;
            }

            var format = ImageSignature.Detect(header[..read]);
            Keep(fullPath, relativePath, size, mtime, format, hasImageName, format == ImageFormat.Unknown
                ? "the content is not JPEG, PNG, GIF, BMP, TIFF or WebP (first bytes "
                    + Convert.ToHexString(header[..Math.Min(read, 8)]) + "); re-export the photo in one of those formats"
                : null);
        }

        /// <summary>
        /// A child the listing returned but that cannot be reached by its name: gone since the listing, or named
        /// with bytes that are not UTF-8 (allowed on Linux), which .NET decodes to U+FFFD, giving a name no file has.
        /// A photo named so is kept as a flagged entry, so ingest records it instead of losing it.
        /// </summary>
        private void TakeUnreachable(FileSystemInfo child, string relativePath)
        {
            if (!child.Name.Contains('\uFFFD', StringComparison.Ordinal))
            {
                Report(new FileNotFoundException(null, child.FullName), child.FullName, relativePath, child is DirectoryInfo ? "folder" : "file");
                return;
            }

            const string BadName = "the name is not valid UTF-8 (its bad bytes are shown as \uFFFD), so it cannot be opened by name; rename it using UTF-8 characters";
            if (child is FileInfo && ImageSignature.HasImageExtension(child.FullName))
            {
                _entries.Add(new CatalogueEntry(child.FullName, relativePath, 0, 0, ImageFormat.Unknown, BadName, "Unreadable"));
                return;
            }

            Add(ScanProblemKind.ReadError, child.FullName, relativePath,
                $"{child.FullName}: {BadName}; this {(child is DirectoryInfo ? "folder" : "file")} was not scanned.");
        }

        private void Keep(string fullPath, string relativePath, long size, long mtime, ImageFormat format,
            bool hasImageName, string? problem)
        {
            if (format == ImageFormat.Unknown && !hasImageName)
            {
                _skippedNonImages++;
                return;
            }

            _entries.Add(new CatalogueEntry(fullPath, relativePath, size, mtime, format,
                format == ImageFormat.Unknown ? problem : null));
        }
    }
}

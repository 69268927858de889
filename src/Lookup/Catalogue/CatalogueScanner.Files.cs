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

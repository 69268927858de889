using System.Collections.Concurrent;
using System.Security.Cryptography;
using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Sweeps;

/// <summary>
/// Previews for the HTML report, made from the catalogue's own files: each photo read from the catalogue root plus
/// its relative path, decoded within the usual limits (EXIF orientation applied), shrunk to fit a square and saved as a
/// small JPEG. A file that is missing, unreadable, outside the root or changed since it was indexed (another SHA-256)
/// gets no preview, and the report shows a placeholder: a preview must show the photo the finding is about.
/// </summary>
public static class CataloguePreviews
{
    /// <summary>Longest side of a preview in pixels.</summary>
    public const int DefaultSide = 160;

    /// <summary>JPEG quality of previews: small files, good enough to compare by eye (common practice for thumbnails).</summary>
    public const int Quality = 75;

    /// <summary>
    /// Makes the previews of the members of the first <paramref name="maxFindings"/> findings, in parallel, and returns
    /// them as the report's preview source.
    /// </summary>
    /// <param name="catalogueRoot">The catalogue root the paths are relative to; null gives no previews.</param>
    /// <param name="findings">The findings the report will show.</param>
    /// <param name="maxFindings">How many of them the report shows.</param>
    /// <param name="side">Longest side of a preview.</param>
    /// <param name="maxDegreeOfParallelism">Threads; 0 means one per core.</param>
    /// <param name="cancellationToken">Stops making previews.</param>
    public static ReportThumbnailSource Prepare(
        string? catalogueRoot,
        IReadOnlyList<SweepFinding> findings,
        int maxFindings = 2000,
        int side = DefaultSide,
        int maxDegreeOfParallelism = 0,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(findings);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(side);
        if (catalogueRoot is null)
        {
            return _ => null;
        }

        var decoder = new PhotoDecoder();
        var members = findings.Take(maxFindings).SelectMany(f => f.Members).DistinctBy(m => (m.Path, m.Sha256)).ToList();
        var made = new ConcurrentDictionary<(string, string), byte[]?>();
        Parallel.ForEach(
            members,
            new ParallelOptions
            {
                MaxDegreeOfParallelism = maxDegreeOfParallelism == 0 ? Environment.ProcessorCount : maxDegreeOfParallelism,
                CancellationToken = cancellationToken,
            },
            m => made[(m.Path, m.Sha256)] = Make(catalogueRoot, m.Path, m.Sha256, side, decoder));
        return m => made.GetValueOrDefault((m.Path, m.Sha256));
    }

    /// <summary>The JPEG preview of one photo, or null when there can be none (see the class summary).</summary>
    public static byte[]? Make(string catalogueRoot, string relativePath, string sha256, int side, PhotoDecoder decoder)
    {
        ArgumentNullException.ThrowIfNull(catalogueRoot);
        ArgumentNullException.ThrowIfNull(relativePath);
        ArgumentNullException.ThrowIfNull(decoder);
        var root = Path.GetFullPath(catalogueRoot);
        var full = Path.GetFullPath(Path.Combine(root, relativePath));
        if (!full.StartsWith(Path.TrimEndingDirectorySeparator(root) + Path.DirectorySeparatorChar, StringComparison.Ordinal))
        {
            return null;
        }

        try
        {
            var bytes = File.ReadAllBytes(full);
            if (!string.Equals(Convert.ToHexStringLower(SHA256.HashData(bytes)), sha256, StringComparison.OrdinalIgnoreCase))
            {
                return null;
            }

            using var photo = decoder.Decode(bytes, full);
            if (photo.Image.Width > side || photo.Image.Height > side)
            {
                photo.Image.Mutate(c => c.Resize(new ResizeOptions { Size = new Size(side, side), Mode = ResizeMode.Max }));
            }

            using var stream = new MemoryStream();
            photo.Image.SaveAsJpeg(stream, new JpegEncoder { Quality = Quality });
            return stream.ToArray();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or PhotoRejectedException)
        {
            return null;
        }
    }
}

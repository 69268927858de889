using System.Security.Cryptography;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Store;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Catalogue;

/// <summary>
/// Everything one photo needs, done by one worker thread: read the bytes once, hash them, decode within the
/// limits, take the dHash and grey thumbnail, embed. A bad photo becomes a failed record, never an exception.
/// Thread safety: safe to call from many threads (the decoder and embedder are shared and thread-safe).
/// </summary>
/// <param name="decoder">Decodes within the run's limits (shared, thread-safe).</param>
/// <param name="embedder">The run's model (shared, thread-safe).</param>
/// <param name="clock">Stamps the records.</param>
/// <param name="readFile">Reads a photo's bytes (default <see cref="File.ReadAllBytes(string)"/>); tests replace it.</param>
internal sealed class PhotoWorker(PhotoDecoder decoder, ImageEmbedder embedder, TimeProvider clock, Func<string, byte[]>? readFile = null)
{
    private readonly Func<string, byte[]> _readFile = readFile ?? File.ReadAllBytes;

    public PhotoOutcome Process(PhotoJob job)
    {
        var entry = job.Current.Entry;
        var record = new PhotoRecord
        {
            Path = entry.RelativePath,
            Sku = job.Current.Sku,
            Size = entry.Size,
            MtimeUtcTicks = entry.MtimeUtcTicks,
            Sha256 = job.Sha256,
            Status = PhotoStatus.Failed,
            UpdatedUtc = clock.GetUtcNow().UtcDateTime,
        };
        if (!entry.IsImage)
        {
            // The decoder's reason names, so the index uses one vocabulary whichever step refused the file.
            string reason = entry.ProblemReason
                ?? (entry.Size == 0 ? nameof(PhotoRejectionReason.EmptyFile) : nameof(PhotoRejectionReason.UnknownFormat));
            return Failed(job, record, reason, $"{entry.FullPath}: {entry.ContentProblem ?? "not an image file"}.");
        }

        try
        {
            if (entry.Size > decoder.Limits.MaxFileBytes)
            {
                throw new PhotoRejectedException(entry.FullPath, PhotoRejectionReason.FileTooLarge,
                    $"{entry.FullPath}: {entry.Size:N0} bytes is over the {decoder.Limits.MaxFileBytes:N0}-byte limit; shrink the file or raise the limit.");
            }

            byte[] bytes = _readFile(entry.FullPath);
            string sha = job.Sha256 ?? Convert.ToHexStringLower(SHA256.HashData(bytes));
            record = record with { Sha256 = sha, Size = bytes.Length };
            using var photo = decoder.Decode(bytes, entry.FullPath);
            var pixels = PhotoThumbnail.EvidenceOf(photo.Image);
            record = record with
            {
                Status = PhotoStatus.Indexed,
                Width = photo.Image.Width,
                Height = photo.Image.Height,
                Format = photo.Info.Format.ToString(),
                DHash = DifferenceHash.Compute(photo.Image),
                Thumbnail = pixels.Thumbnail,
                Detail = pixels.Detail,
                Chroma = pixels.Chroma,
            };
            if (job.EvidenceOnly)
            {
                // An unchanged photo indexed before the finer pixel evidence was stored: no embedding is needed.
                return new PhotoOutcome(job, record, null);
            }

            var embedding = new float[embedder.Dimension];
            embedder.Embed(photo.Image, embedding);
            return new PhotoOutcome(job, record, embedding);
        }
        catch (PhotoRejectedException e)
        {
            return Failed(job, record, e.Reason.ToString(), e.Message);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Size, time and hash are cleared so the next run sees the file as changed and reads it again: a
            // read error says nothing about the content, unlike a decode failure, which is kept until the file changes.
            return Failed(job, record with { Size = 0, MtimeUtcTicks = 0, Sha256 = null }, nameof(PhotoRejectionReason.Unreadable),
                $"{entry.FullPath}: could not be read ({e.Message}); check that the file exists and is readable, then run ingest again.");
        }
    }

    private static PhotoOutcome Failed(PhotoJob job, PhotoRecord record, string reason, string message) =>
        new(job, record with { Status = PhotoStatus.Failed, FailureReason = reason, FailureMessage = message }, null);

    /// <summary>The sweep's 32 × 32 grey thumbnail of the whole photo (see <see cref="PhotoThumbnail"/>).</summary>
    internal static byte[] Thumbnail(Image<Rgb24> image) => PhotoThumbnail.Of(image);
}

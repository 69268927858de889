using System.Security.Cryptography;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Store;
using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Catalogue;

/// <summary>
/// Everything one photo needs, done by one worker thread: read the bytes once, hash them, decode within the
/// limits, take the dHash and grey thumbnail, embed. A bad photo becomes a failed record, never an exception.
/// Thread safety: safe to call from many threads (the decoder and embedder are shared and thread-safe).
/// </summary>
internal sealed class PhotoWorker(PhotoDecoder decoder, ImageEmbedder embedder, TimeProvider clock)
{
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
            return Failed(job, record, "NotAnImage", entry.ContentProblem ?? $"{entry.FullPath}: not an image file.");
        }

        try
        {
            if (entry.Size > decoder.Limits.MaxFileBytes)
            {
                throw new PhotoRejectedException(entry.FullPath, PhotoRejectionReason.FileTooLarge,
                    $"{entry.FullPath}: {entry.Size:N0} bytes is over the {decoder.Limits.MaxFileBytes:N0}-byte limit; shrink the file or raise the limit.");
            }

            byte[] bytes = File.ReadAllBytes(entry.FullPath);
            string sha = job.Sha256 ?? Convert.ToHexStringLower(SHA256.HashData(bytes));
            record = record with { Sha256 = sha, Size = bytes.Length };
            using var photo = decoder.Decode(bytes, entry.FullPath);
            var embedding = new float[embedder.Dimension];
            embedder.Embed(photo.Image, embedding);
            return new PhotoOutcome(job, record with
            {
                Status = PhotoStatus.Indexed,
                Width = photo.Image.Width,
                Height = photo.Image.Height,
                Format = photo.Info.Format.ToString(),
                DHash = DifferenceHash.Compute(photo.Image),
                Thumbnail = Thumbnail(photo.Image),
            }, embedding);
        }
        catch (PhotoRejectedException e)
        {
            return Failed(job, record, e.Reason.ToString(), e.Message);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return Failed(job, record, "Unreadable", $"{entry.FullPath}: could not be read ({e.Message}); check that the file exists and is readable.");
        }
    }

    private static PhotoOutcome Failed(PhotoJob job, PhotoRecord record, string reason, string message) =>
        new(job, record with { Status = PhotoStatus.Failed, FailureReason = reason, FailureMessage = message }, null);

    /// <summary>The sweep's 32 × 32 grey thumbnail of the whole photo.</summary>
    internal static byte[] Thumbnail(Image<Rgb24> image)
    {
        using var grey = image.CloneAs<L8>();
        byte[] pixels = new byte[image.Width * image.Height];
        grey.CopyPixelDataTo(pixels);
        return GreyThumbnail.FromGrey(pixels, image.Width, image.Height).Pixels.ToArray();
    }
}

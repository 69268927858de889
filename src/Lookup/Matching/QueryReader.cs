using System.Security.Cryptography;
using Lookup.Imaging;

namespace Lookup.Matching;

/// <summary>
/// Reads a query photo once: size check, bytes, SHA-256, decode within the limits, dHash, crop regions. Needs no
/// model, so it runs while the network loads. Thread-safe (the decoder is).
/// </summary>
internal sealed class QueryReader(PhotoDecoder decoder)
{
    /// <exception cref="PhotoRejectedException">The file cannot be used; the message names it and the fix.</exception>
    public PreparedQuery Read(string path, CropSet crops)
    {
        byte[] bytes;
        try
        {
            long length = new FileInfo(path).Length;
            if (length > decoder.Limits.MaxFileBytes)
            {
                throw PhotoRejections.FileTooLarge(path, length, decoder.Limits.MaxFileBytes);
            }

            bytes = File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw PhotoRejections.Unreadable(path, e);
        }

        var photo = decoder.Decode(bytes, path);
        try
        {
            var image = photo.Image;
            return new PreparedQuery(
                path,
                Convert.ToHexStringLower(SHA256.HashData(bytes)),
                Imaging.DifferenceHash.Compute(image),
                photo,
                QueryCrops.For(image.Width, image.Height, crops));
        }
        catch
        {
            photo.Dispose();
            throw;
        }
    }
}

using System.Globalization;

namespace Lookup.Imaging;

/// <summary>Builds every <see cref="PhotoRejectedException"/> so each message names the file, the numbers and the fix.</summary>
internal static class PhotoRejections
{
    private static readonly CultureInfo Invariant = CultureInfo.InvariantCulture;

    public static PhotoRejectedException EmptyFile(string path) =>
        new(path, PhotoRejectionReason.EmptyFile,
            $"{path}: the file is empty (0 bytes). Copy or export the photo again from its source.");

    public static PhotoRejectedException UnknownFormat(string path, ReadOnlySpan<byte> head) =>
        new(path, PhotoRejectionReason.UnknownFormat,
            $"{path}: not a JPEG, PNG, GIF, TIFF, WebP or BMP image (it starts with bytes {Hex(head)}). Convert it to JPEG or PNG, or move it out of the photo folder.");

    public static PhotoRejectedException Corrupt(string path, PhotoFormat format, string detail, Exception? inner = null) =>
        new(path, PhotoRejectionReason.Corrupt,
            $"{path}: the {format.ToString().ToUpperInvariant()} data is truncated or damaged ({detail}). Copy or export the photo again from its source.", inner);

    public static PhotoRejectedException TooManyPixels(string path, long width, long height, long limit) =>
        new(path, PhotoRejectionReason.TooManyPixels,
            string.Create(Invariant,
                $"{path}: {width} × {height} = {width * height / 1e6:0.#} MP is over the limit of {limit / 1e6:0.#} MP. Downscale the photo, or raise the pixel limit if the photo is genuine."));

    public static PhotoRejectedException OutOfMemory(string path, long width, long height, Exception inner) =>
        new(path, PhotoRejectionReason.TooManyPixels,
            string.Create(Invariant,
                $"{path}: not enough memory to decode {width} × {height} pixels. Downscale the photo, lower the pixel limit, or run fewer workers."), inner);

    public static PhotoRejectedException FileTooLarge(string path, long bytes, long limit) =>
        new(path, PhotoRejectionReason.FileTooLarge,
            string.Create(Invariant,
                $"{path}: {bytes:N0} bytes is over the file-size limit of {limit:N0} bytes. Export a smaller JPEG, or raise the file-size limit if the photo is genuine."));

    public static PhotoRejectedException TooManyFrames(string path, int frames, int limit) =>
        new(path, PhotoRejectionReason.TooManyFrames,
            string.Create(Invariant,
                $"{path}: the file declares {frames:N0} frames or pages, over the limit of {limit:N0}. Export the product view as a single still image."));

    public static PhotoRejectedException Unsupported(string path, PhotoFormat format, string detail, Exception? inner = null) =>
        new(path, PhotoRejectionReason.Unsupported,
            $"{path}: this {format.ToString().ToUpperInvariant()} uses a feature the decoder does not support ({detail}). Convert it to JPEG or PNG.", inner);

    public static PhotoRejectedException Unreadable(string path, Exception inner) =>
        new(path, PhotoRejectionReason.Unreadable,
            $"{path}: the file could not be read ({inner.Message}). Check that it exists and that this user may read it.", inner);

    public static PhotoRejectedException TimedOut(string path, TimeSpan limit, Exception? inner = null) =>
        new(path, PhotoRejectionReason.TimedOut,
            string.Create(Invariant,
                $"{path}: decoding took longer than the limit of {limit.TotalSeconds:0.###} s. Export a smaller photo, or raise the decode time limit on a slow machine."), inner);

    private static string Hex(ReadOnlySpan<byte> head)
    {
        var shown = head[..Math.Min(head.Length, 8)];
        return shown.IsEmpty ? "(none)" : Convert.ToHexString(shown);
    }
}

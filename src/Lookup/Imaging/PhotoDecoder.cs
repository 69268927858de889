using System.Buffers;
using System.Diagnostics;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats;
using SixLabors.ImageSharp.Formats.Bmp;
using SixLabors.ImageSharp.Formats.Gif;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Formats.Tiff;
using SixLabors.ImageSharp.Formats.Webp;
using SixLabors.ImageSharp.Memory;
using SixLabors.ImageSharp.Metadata;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Imaging;

/// <summary>
/// Turns a photo file into upright 8-bit RGB pixels, or a <see cref="PhotoRejectedException"/> saying why not.
/// Order of work: file size → format from the first bytes → container walk (truncation, frame count, GIF frame
/// sizes) → header (pixel count) → decode under a deadline, metadata ignored → EXIF orientation read from the
/// bytes → RGB over white. Nothing is decoded until the header
/// has passed the limits. Thread-safe: one instance serves every worker.
/// </summary>
public sealed class PhotoDecoder
{
    private readonly Configuration configuration;

    /// <summary>Creates a decoder that enforces <paramref name="limits"/> (default: <see cref="PhotoLimits.Default"/>).</summary>
    public PhotoDecoder(PhotoLimits? limits = null)
    {
        Limits = limits ?? PhotoLimits.Default;
        Limits.Validate();
        configuration = CreateConfiguration();
    }

    /// <summary>The limits this decoder enforces.</summary>
    public PhotoLimits Limits { get; }

    /// <summary>Reads and decodes the file at <paramref name="path"/>.</summary>
    /// <exception cref="PhotoRejectedException">The file cannot be used; the message says why and what to do.</exception>
    public DecodedPhoto Decode(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        byte[]? rented = null;
        try
        {
            var length = ReadFile(path, ref rented);
            return Decode(rented.AsMemory(0, length), path);
        }
        finally
        {
            if (rented is not null)
            {
                ArrayPool<byte>.Shared.Return(rented);
            }
        }
    }

    /// <summary>
    /// Decodes a photo whose bytes the caller has already read (for example to hash them); <paramref name="path"/>
    /// is used only in messages.
    /// </summary>
    /// <exception cref="PhotoRejectedException">The bytes cannot be used; the message says why and what to do.</exception>
    public DecodedPhoto Decode(ReadOnlyMemory<byte> content, string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        if (content.IsEmpty)
        {
            throw PhotoRejections.EmptyFile(path);
        }

        if (content.Length > Limits.MaxFileBytes)
        {
            throw PhotoRejections.FileTooLarge(path, content.Length, Limits.MaxFileBytes);
        }

        var imageFormat = Image.DetectFormat(configuration, content.Span);
        var format = ToPhotoFormat(imageFormat) ?? throw PhotoRejections.UnknownFormat(path, content.Span);
        var scan = ScanContainer(format, content.Span);
        if (!scan.Complete)
        {
            throw PhotoRejections.Corrupt(path, format, scan.Problem ?? "incomplete");
        }

        if (scan.Frames > Limits.MaxFrames)
        {
            throw PhotoRejections.TooManyFrames(path, scan.Frames, Limits.MaxFrames);
        }

        if ((long)scan.LargestFrame.Width * scan.LargestFrame.Height > Limits.MaxPixels)
        {
            throw PhotoRejections.TooManyPixels(path, scan.LargestFrame.Width, scan.LargestFrame.Height, Limits.MaxPixels);
        }

        if (format == PhotoFormat.Tiff)
        {
            content = TiffContainer.ClampRowsPerStrip(content);
        }

        var decoder = configuration.ImageFormatsManager.FindDecoder(imageFormat);
        var header = Identify(decoder, content, path, format);
        var image = DecodePixels(decoder, content, path, format, header);
        var orientation = ExifOrientation.Read(ExifBlock.Find(format, content.Span));
        ExifOrientation.Apply(image, orientation);
        var info = new PhotoInfo(format, header.Width, header.Height, content.Length, scan.Frames, orientation);
        return new DecodedPhoto(path, image, info);
    }

    private int ReadFile(string path, ref byte[]? rented)
    {
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1, FileOptions.SequentialScan);
            var length = stream.Length;
            if (length == 0)
            {
                throw PhotoRejections.EmptyFile(path);
            }

            if (length > Limits.MaxFileBytes)
            {
                throw PhotoRejections.FileTooLarge(path, length, Limits.MaxFileBytes);
            }

            rented = ArrayPool<byte>.Shared.Rent((int)length);
            return stream.ReadAtLeast(rented.AsSpan(0, (int)length), (int)length, throwOnEndOfStream: false);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or System.Security.SecurityException)
        {
            throw PhotoRejections.Unreadable(path, e);
        }
    }

    private IImageInfo Identify(IImageDecoder decoder, ReadOnlyMemory<byte> content, string path, PhotoFormat format)
    {
        IImageInfo? header;
        try
        {
            using var stream = new DeadlineReadStream(content, Deadline());
            header = ((IImageInfoDetector)decoder).Identify(configuration, stream, CancellationToken.None);
        }
        catch (Exception e)
        {
            throw Translate(e, path, format, width: 0, height: 0);
        }

        if (header is null || header.Width <= 0 || header.Height <= 0)
        {
            throw PhotoRejections.Corrupt(path, format, "the header declares no image size");
        }

        if ((long)header.Width * header.Height > Limits.MaxPixels)
        {
            throw PhotoRejections.TooManyPixels(path, header.Width, header.Height, Limits.MaxPixels);
        }

        return header;
    }

    private Image<Rgb24> DecodePixels(IImageDecoder decoder, ReadOnlyMemory<byte> content, string path, PhotoFormat format, IImageInfo header)
    {
        using var timeout = new CancellationTokenSource(Limits.DecodeTimeout);
        var deadline = Deadline();
        Image<Rgb24>? image = null;
        try
        {
            using var stream = new DeadlineReadStream(content, deadline);
            if (format == PhotoFormat.Jpeg)
            {
                // JPEG has no alpha: decode straight to RGB (grey, CMYK and YCCK are converted by the decoder).
                image = decoder.Decode<Rgb24>(configuration, stream, timeout.Token);
            }
            else
            {
                using var withAlpha = decoder.Decode<Rgba32>(configuration, stream, timeout.Token);
                image = AlphaFlattening.OverWhite(withAlpha, configuration);
            }

            // WebP, BMP and uncompressed TIFF read their data in one go and cannot be interrupted; a decode that
            // overran is still refused, so the outcome for a file does not depend on its format.
            if (Stopwatch.GetTimestamp() > deadline)
            {
                throw new TimeoutException("The decode finished after its deadline.");
            }

            return image;
        }
        catch (Exception e)
        {
            image?.Dispose();
            throw Translate(e, path, format, header.Width, header.Height);
        }
    }

    private PhotoRejectedException Translate(Exception e, string path, PhotoFormat format, long width, long height) => e switch
    {
        PhotoRejectedException rejected => rejected,
        TimeoutException or OperationCanceledException => PhotoRejections.TimedOut(path, Limits.DecodeTimeout, e),
        InvalidMemoryOperationException or OutOfMemoryException => PhotoRejections.OutOfMemory(path, width, height, e),
        NotSupportedException or NotImplementedException => PhotoRejections.Unsupported(path, format, e.Message, e),
        UnknownImageFormatException => PhotoRejections.UnknownFormat(path, []),

        // Anything else a decoder throws on crafted or damaged bytes (ImageFormatException, InvalidImageContentException,
        // EndOfStreamException, index errors) means the data cannot be decoded.
        _ => PhotoRejections.Corrupt(path, format, e.Message, e),
    };

    private long Deadline() =>
        Stopwatch.GetTimestamp() + (long)(Limits.DecodeTimeout.TotalSeconds * Stopwatch.Frequency);

    private static ContainerScan ScanContainer(PhotoFormat format, ReadOnlySpan<byte> data) => format switch
    {
        PhotoFormat.Jpeg => JpegContainer.Scan(data),
        PhotoFormat.Png => PngContainer.Scan(data),
        PhotoFormat.Gif => GifContainer.Scan(data),
        PhotoFormat.Tiff => TiffContainer.Scan(data),
        PhotoFormat.Webp => WebpContainer.Scan(data),
        _ => BmpContainer.Scan(data),
    };

    private static PhotoFormat? ToPhotoFormat(IImageFormat? format) => format switch
    {
        JpegFormat => PhotoFormat.Jpeg,
        PngFormat => PhotoFormat.Png,
        GifFormat => PhotoFormat.Gif,
        TiffFormat => PhotoFormat.Tiff,
        WebpFormat => PhotoFormat.Webp,
        BmpFormat => PhotoFormat.Bmp,
        _ => null,
    };

    /// <summary>
    /// Only the six formats Lookup accepts are registered: TGA has no signature, so its detector would take random
    /// bytes for an image. Processing runs on one thread because ingest already runs one worker per core. Metadata
    /// is never parsed (crafted EXIF and compressed text chunks cost seconds and memory in ImageSharp 2.1's readers);
    /// the orientation is read from the bytes by <see cref="ExifBlock"/> instead.
    /// </summary>
    private static Configuration CreateConfiguration()
    {
        var configuration = new Configuration(
            new JpegConfigurationModule(),
            new PngConfigurationModule(),
            new GifConfigurationModule(),
            new TiffConfigurationModule(),
            new WebpConfigurationModule(),
            new BmpConfigurationModule())
        {
            MaxDegreeOfParallelism = 1,
        };

        // Never decode all frames of an animation: the first is the photo.
        configuration.ImageFormatsManager.SetDecoder(GifFormat.Instance, new GifDecoder { DecodingMode = FrameDecodingMode.First, MaxFrames = 1, IgnoreMetadata = true });
        configuration.ImageFormatsManager.SetDecoder(TiffFormat.Instance, new TiffDecoder { DecodingMode = FrameDecodingMode.First, IgnoreMetadata = true });
        configuration.ImageFormatsManager.SetDecoder(JpegFormat.Instance, new JpegDecoder { IgnoreMetadata = true });
        configuration.ImageFormatsManager.SetDecoder(PngFormat.Instance, new PngDecoder { IgnoreMetadata = true });
        configuration.ImageFormatsManager.SetDecoder(WebpFormat.Instance, new WebpDecoder { IgnoreMetadata = true });
        return configuration;
    }
}

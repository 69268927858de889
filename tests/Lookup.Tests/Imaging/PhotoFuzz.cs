using System.Diagnostics;
using Lookup.Catalogue;
using Lookup.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats;
using SixLabors.ImageSharp.Formats.Gif;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.Formats.Png;
using SixLabors.ImageSharp.Formats.Tiff;
using SixLabors.ImageSharp.Formats.Webp;
using SixLabors.ImageSharp.PixelFormats;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Imaging;

/// <summary>
/// Byte-mutation fuzzing of the photo decoder (<see cref="PhotoDecoder.Decode(ReadOnlyMemory{byte}, string)"/>) and
/// the pixel steps ingest runs on what it returns (dHash, the sweep thumbnail). Seeds are small valid files encoded
/// by SixLabors.ImageSharp from scikit-image's chelsea.png (tests/reference-data). The only exception allowed out
/// is <see cref="PhotoRejectedException"/>; every case must answer within its decode limit plus a watchdog margin.
/// Shared by the test suite and <c>Lookup.Bench fuzz</c>.
/// </summary>
internal static class PhotoFuzz
{
    /// <summary>How long a case may take beyond its decode limit before it counts as hung.</summary>
    private static readonly TimeSpan WatchdogMargin = TimeSpan.FromSeconds(10);

    /// <summary>The seed files: JPEG, PNG (RGB and palette), WebP (lossy and lossless), GIF and TIFF.</summary>
    public static IReadOnlyList<(string Name, byte[] Bytes)> Seeds()
    {
        using var photo = Image.Load<Rgb24>(ReferenceData.SkImage("chelsea.png"));
        photo.Mutate(x => x.Resize(40, 27));
        return
        [
            ("seed.jpg", Encode(photo, new JpegEncoder { Quality = 75 })),
            ("seed.png", Encode(photo, new PngEncoder())),
            ("seed-palette.png", Encode(photo, new PngEncoder { ColorType = PngColorType.Palette })),
            ("seed-lossy.webp", Encode(photo, new WebpEncoder { FileFormat = WebpFileFormatType.Lossy })),
            ("seed-lossless.webp", Encode(photo, new WebpEncoder { FileFormat = WebpFileFormatType.Lossless })),
            ("seed.gif", Encode(photo, new GifEncoder())),
            ("seed.tif", Encode(photo, new TiffEncoder())),
        ];
    }

    /// <summary>Case <paramref name="index"/> of the run with <paramref name="seed"/>, for replaying a reported case.</summary>
    public static (string Name, byte[] Bytes, string Edits) Case(int seed, int index)
    {
        var seeds = Seeds();
        var mutator = new ByteMutator(seed);
        for (var i = 0; ; i++)
        {
            var (name, original) = seeds[i % seeds.Count];
            var (bytes, edits) = mutator.Mutate(original);
            if (i == index)
            {
                return (name, bytes, edits);
            }
        }
    }

    /// <summary>Runs <paramref name="cases"/> mutated files through the decoder, round-robin over the seeds.</summary>
    public static FuzzReport Run(int cases, int seed, PhotoLimits limits)
    {
        var seeds = Seeds();
        var decoder = new PhotoDecoder(limits);
        var mutator = new ByteMutator(seed);
        var watchdog = limits.DecodeTimeout + WatchdogMargin;
        var report = new FuzzReport();
        for (var i = 0; i < cases; i++)
        {
            var (name, original) = seeds[i % seeds.Count];
            var (bytes, edits) = mutator.Mutate(original);
            var label = $"case {i} (seed {seed}) of {name}: {edits}";
            var clock = Stopwatch.StartNew();
            var task = Task.Run(() => Decode(decoder, bytes, $"fuzz-{i}-{name}"));
            if (!task.Wait(watchdog))
            {
                report.Problems.Add($"{label}: no answer within {watchdog.TotalSeconds:0} s");
                continue;
            }

            var elapsed = clock.Elapsed.TotalMilliseconds;
            if (elapsed > report.SlowestMilliseconds)
            {
                (report.SlowestMilliseconds, report.Slowest) = (elapsed, label);
            }

            report.Cases++;
            switch (task.Result)
            {
                case null:
                    report.Decoded++;
                    break;
                case PhotoRejectedException rejected:
                    report.Rejected[rejected.Reason.ToString()] = report.Rejected.GetValueOrDefault(rejected.Reason.ToString()) + 1;
                    break;
                case var other:
                    report.Problems.Add($"{label}: {other.GetType().Name}: {other.Message}\n{other.StackTrace}");
                    break;
            }
        }

        return report;
    }

    /// <summary>Null when the file decoded and its pixels went through dHash and the thumbnail; otherwise what was thrown.</summary>
    private static Exception? Decode(PhotoDecoder decoder, byte[] bytes, string path)
    {
        try
        {
            using var photo = decoder.Decode(bytes, path);
            _ = DifferenceHash.Compute(photo.Image);
            _ = PhotoThumbnail.Of(photo.Image);
            return null;
        }
        catch (Exception e)
        {
            return e;
        }
    }

    private static byte[] Encode(Image image, IImageEncoder encoder)
    {
        using var stream = new MemoryStream();
        image.Save(stream, encoder);
        return stream.ToArray();
    }
}

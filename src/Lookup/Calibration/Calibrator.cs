using System.Diagnostics;
using Lookup.Embedding;
using Lookup.Graph;
using Lookup.Imaging;
using Lookup.Store;

namespace Lookup.Calibration;

/// <summary>
/// Measures verdict thresholds on the catalogue itself. Sampled photos are edited into true copies in memory and
/// embedded; their distances to the originals' stored embeddings describe copies. Stored embeddings give siblings
/// (different photos of one SKU) and strangers (photos of different SKUs). SKUs are split in two halves: limits are
/// chosen on one (<see cref="ThresholdChooser"/>) and measured on the other (<see cref="HeldOutRates"/>).
/// Thread safety: one run at a time per instance; copies are made on <see cref="CalibrationOptions.Workers"/>
/// threads sharing the thread-safe embedder and decoder.
/// </summary>
public sealed class Calibrator(ImageEmbedder embedder, PhotoDecoder decoder, TimeProvider? clock = null)
{
    private readonly TimeProvider _clock = clock ?? TimeProvider.System;

    /// <summary>Runs one calibration. Nothing is written: store the result with <see cref="CalibrationResult.Store"/>.</summary>
    /// <exception cref="CalibrationException">The index is too small, its photos are missing, or the model differs.</exception>
    /// <exception cref="OperationCanceledException">Cancelled.</exception>
    public CalibrationResult Run(CalibrationInput input, CalibrationOptions options, IProgress<CalibrationProgress>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        input.CheckUsable(options);
        input.CheckModel(embedder.Fingerprint, embedder.Card.Name);
        var started = Stopwatch.StartNew();

        var groups = PhotoGroups.Of(input.Photos.Select(p => p.Sku!).ToList(), input.Photos.Select(p => p.Sha256).ToList());
        var heldOutSku = SkuHalves.Split(groups.SkuCount, options.Seed);
        var sample = Sample(input.Photos.Count, options);
        var (copies, skipped) = MakeCopies(input, sample, options, progress, cancellationToken);
        if (copies.Length == 0)
        {
            throw new CalibrationException(CalibrationProblem.NoReadablePhotos,
                $"None of the {sample.Length} sampled photos under {input.CatalogueRoot} could be used ({skipped[0].Path}: {skipped[0].Reason}). Run ingest again so the index matches the files, then calibrate.");
        }

        var sampler = new PairSampler(input.Vectors, input.Dimension, groups);
        var random = new Random(unchecked(options.Seed + 31));
        DistanceSet Half(bool heldOut)
        {
            var members = SkuHalves.Members(groups, heldOutSku, heldOut);
            var halfCopies = copies.Where(c => heldOutSku[groups.Sku[c.Photo]] == heldOut).ToArray();
            return new DistanceSet(halfCopies, sampler.Siblings(members, options.MaxPairsPerHalf, random), sampler.Strangers(members, options.MaxPairsPerHalf, random));
        }

        var fit = Half(heldOut: false);
        var held = Half(heldOut: true);

        var limits = ThresholdChooser.Choose(fit, options);
        var measured = HeldOutRates.Measure(held, limits);
        int photosUsed = sample.Length - skipped.Count;
        var thresholds = new VerdictThresholds(
            limits.Copy,
            limits.SamePart,
            input.Current.MinMargin,
            "calibrated",
            _clock.GetUtcNow().UtcDateTime,
            photosUsed,
            input.PhotosIndexed,
            input.ModelFingerprint,
            options.TargetFalseMatchRate);
        var result = new CalibrationResult
        {
            Thresholds = thresholds,
            Limits = limits,
            Measured = measured,
            Histograms = DistanceHistograms.From(copies.Select(c => c.Distance), fit.Siblings.Concat(held.Siblings), fit.Strangers.Concat(held.Strangers)),
            Options = options,
            Photos = input.Photos.Count,
            Skus = groups.SkuCount,
            SkusWithSiblings = SkusWithSiblings(groups),
            FitSkus = heldOutSku.Count(h => !h),
            HeldOutSkus = heldOutSku.Count(h => h),
            PhotosSampled = sample.Length,
            Copies = copies.Length,
            FitCopies = fit.Copies.Length,
            FitSiblingPairs = fit.Siblings.Length,
            FitStrangerPairs = fit.Strangers.Length,
            Skipped = skipped,
            Elapsed = started.Elapsed,
        };
        return result with { Warnings = CalibrationWarnings.For(result, sample.Length) };
    }

    /// <summary>A seeded sample of photo indices, in ascending order.</summary>
    private static int[] Sample(int photos, CalibrationOptions options)
    {
        var order = Enumerable.Range(0, photos).ToArray();
        new Random(options.Seed).Shuffle(order);
        var sample = order.AsSpan(0, Math.Min(options.SampleSize, photos)).ToArray();
        Array.Sort(sample);
        return sample;
    }

    private static int SkusWithSiblings(PhotoGroups groups) =>
        Enumerable.Range(0, groups.Sku.Length).GroupBy(i => groups.Sku[i]).Count(g => g.Select(i => groups.Content[i]).Distinct().Count() > 1);

    private (CopyDistance[] Copies, List<SkippedPhoto> Skipped) MakeCopies(CalibrationInput input, int[] sample, CalibrationOptions options, IProgress<CalibrationProgress>? progress, CancellationToken cancellationToken)
    {
        var perPhoto = new CopyDistance[sample.Length][];
        var skipped = new SkippedPhoto?[sample.Length];
        int done = 0;
        int skippedCount = 0;
        var gate = new Lock();
        progress?.Report(new CalibrationProgress("copies", 0, sample.Length, 0));
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = options.Workers, CancellationToken = cancellationToken };
        Parallel.For(0, sample.Length, parallel, position =>
        {
            int photo = sample[position];
            string? problem = CopiesOf(input, photo, options, out perPhoto[position]);
            lock (gate)
            {
                if (problem is not null)
                {
                    skipped[position] = new SkippedPhoto(input.Photos[photo].Path, problem);
                    skippedCount++;
                }

                done++;
                progress?.Report(new CalibrationProgress("copies", done, sample.Length, skippedCount));
            }
        });

        return (perPhoto.Where(p => p is not null).SelectMany(p => p).ToArray(), skipped.OfType<SkippedPhoto>().ToList());
    }

    /// <summary>Makes and embeds every copy of one photo; returns why it could not, or null.</summary>
    private string? CopiesOf(CalibrationInput input, int photo, CalibrationOptions options, out CopyDistance[] copies)
    {
        copies = [];
        var record = input.Photos[photo];
        string path = Path.Combine(input.CatalogueRoot, record.Path);
        string? changed = ChangedSinceIngest(record, path);
        if (changed is not null)
        {
            return changed;
        }

        try
        {
            using var original = decoder.Decode(path);
            var edits = CopyEditPlan.Draw(CopyEditPlan.ForPhoto(options.Seed, record.Path), options.Edits);
            var embedding = new float[embedder.Dimension];
            var result = new CopyDistance[edits.Length];
            for (int e = 0; e < edits.Length; e++)
            {
                using var copy = CopyMaker.Make(original.Image, edits[e], decoder, path);
                embedder.Embed(copy.Image, embedding);
                result[e] = new CopyDistance(photo, edits[e].Kind, CosineKernel.Distance(input.Vector(photo), embedding));
            }

            copies = result;
            return null;
        }
        catch (PhotoRejectedException e)
        {
            return e.Message;
        }
    }

    /// <summary>A photo whose file differs from what ingest embedded would give meaningless copy distances.</summary>
    private static string? ChangedSinceIngest(PhotoRecord record, string path)
    {
        try
        {
            var info = new FileInfo(path);
            if (info.LinkTarget is not null && info.ResolveLinkTarget(returnFinalTarget: true) is FileInfo target)
            {
                info = target;
            }

            if (!info.Exists)
            {
                return $"{path} is gone since ingest; run ingest again to retire it.";
            }

            return info.Length == record.Size && info.LastWriteTimeUtc.Ticks == record.MtimeUtcTicks
                ? null
                : $"{path} changed since ingest ({info.Length:N0} bytes now, {record.Size:N0} then); run ingest again so its embedding is current.";
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return $"{path} could not be read ({e.Message}).";
        }
    }
}

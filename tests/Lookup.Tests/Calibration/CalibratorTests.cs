using Lookup.Calibration;
using Lookup.Graph;
using Lookup.Store;
using Lookup.Tests.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Tests.Calibration;

/// <summary>Calibration of the reference catalogue (open photos, see <see cref="ReferenceCatalogue"/>).</summary>
[Collection(ReferenceCatalogueCollection.Name)]
public sealed class CalibratorTests(ReferenceCatalogue catalogue)
{
    [Fact]
    public void Run_on_the_reference_photos_gives_a_copy_band_inside_the_same_part_band_below_most_strangers()
    {
        var r = catalogue.Result;

        Assert.True(r.Thresholds.Copy > 0, $"copy limit {r.Thresholds.Copy}");
        Assert.True(r.Thresholds.Copy < r.Thresholds.SamePart, $"copy {r.Thresholds.Copy} vs same part {r.Thresholds.SamePart}");
        float strangerMedian = HistogramMedian(r.Histograms.Strangers, r.Histograms.BinWidth);
        Assert.True(r.Thresholds.SamePart < strangerMedian, $"same part {r.Thresholds.SamePart} vs stranger median {strangerMedian}");
        Assert.Equal("calibrated", r.Thresholds.Source);
        Assert.Equal(65, r.Photos);
        Assert.Equal(55, r.Skus);
        Assert.Equal(10, r.SkusWithSiblings);
    }

    [Fact]
    public void Every_planted_copy_kind_of_the_sweep_tests_falls_inside_the_copy_band()
    {
        // The sweep tests' planted edits (PlantedEdits: byte copy, JPEG q40, half size, 80 % crop, brightness +30 %,
        // mirror, 4° straighten) on their twelve reference photos, measured against each original's stored embedding.
        float copy = catalogue.Result.Thresholds.Copy;
        var outside = new List<string>();
        var embedding = new float[catalogue.Embedder.Dimension];
        foreach (string source in ReferencePhotos.Sources)
        {
            byte[] original = File.ReadAllBytes(ReferencePhotos.PathOf(source));
            using var image = Image.Load<Rgb24>(original);
            var stored = catalogue.StoredVector(ReferenceCatalogue.CataloguePath(source));
            foreach (var (name, _, _) in PlantedEdits.All)
            {
                using var planted = catalogue.Decoder.Decode(PlantedEdits.Apply(name, image, original), source);
                catalogue.Embedder.Embed(planted.Image, embedding);
                float distance = CosineKernel.Distance(stored, embedding);
                if (distance > copy)
                {
                    outside.Add($"{source} {name}: {distance:0.000}");
                }
            }
        }

        Assert.True(outside.Count == 0, $"copy band ≤ {copy:0.000}; outside: {string.Join("; ", outside)}");
    }

    [Fact]
    public void The_halves_share_no_sku_and_together_hold_every_measured_pair()
    {
        var r = catalogue.Result;
        var m = r.Measured;

        Assert.Equal(r.Skus, r.FitSkus + r.HeldOutSkus);
        Assert.Equal(r.Copies, r.FitCopies + m.CopiesInCopyBand.Total);
        Assert.Equal(r.PhotosSampled * r.Options.Edits.Count, r.Copies);
        Assert.Equal(r.Histograms.Strangers.Sum(), r.FitStrangerPairs + m.StrangersInCopyBand.Total);
        Assert.Equal(r.Histograms.Siblings.Sum(), r.FitSiblingPairs + m.SiblingsInCopyBand.Total);
        Assert.Equal(r.Histograms.Copies.Sum(), r.Copies);
        Assert.Equal(m.CopiesInCopyBand.Total, m.ByEdit.Sum(e => e.InCopyBand.Total));
    }

    [Fact]
    public void The_wider_band_holds_at_least_what_the_narrower_holds()
    {
        var m = catalogue.Result.Measured;

        Assert.True(m.CopiesInSamePartBand.Inside >= m.CopiesInCopyBand.Inside);
        Assert.True(m.StrangersInSamePartBand.Inside >= m.StrangersInCopyBand.Inside);
        Assert.True(m.SiblingsInSamePartBand.Inside >= m.SiblingsInCopyBand.Inside);
        Assert.All(m.ByEdit, e => Assert.True(e.Median <= e.Max));
    }

    [Fact]
    public void Storing_a_result_writes_the_thresholds_and_the_record_with_its_histograms()
    {
        var r = catalogue.Result;
        string path = catalogue.CopyOfIndex();

        using (var file = IndexFile.Open(path, IndexAccess.Write))
        {
            r.Store(file);
        }

        using var reader = IndexFile.Open(path, IndexAccess.Read);
        var stored = VerdictThresholds.ReadOrDefault(reader);
        Assert.Equal("calibrated", stored.Source);
        Assert.Equal(r.Limits.Copy, stored.Copy);
        Assert.Equal(r.Limits.SamePart, stored.SamePart);
        Assert.Equal(VerdictThresholds.Default.MinMargin, stored.MinMargin);
        Assert.Equal(65, stored.PhotosAtCalibration);
        Assert.Equal(r.PhotosSampled, stored.SampleSize);
        Assert.Equal(catalogue.Input.ModelFingerprint, stored.ModelFingerprint);
        Assert.Equal(0.01, stored.TargetFalseMatchRate);
        Assert.NotNull(stored.CalibratedUtc);
        var record = CalibrationRecord.Read(reader);
        Assert.NotNull(record);
        Assert.Equal(r.Histograms.Strangers, record.Histograms.Strangers);
        Assert.Equal(r.Histograms.Copies, record.Histograms.Copies);
        Assert.Equal(r.Measured.StrangersInCopyBand, record.StrangersInCopyBand);
    }

    [Fact]
    public void The_same_seed_gives_the_same_thresholds_and_copies()
    {
        var options = ReferenceCatalogue.Options with { SampleSize = 5, Edits = [CopyEditKind.Crop, CopyEditKind.Straighten] };
        var calibrator = new Calibrator(catalogue.Embedder, catalogue.Decoder);

        var first = calibrator.Run(catalogue.Input, options);
        var second = calibrator.Run(catalogue.Input, options);

        Assert.Equal(first.Limits, second.Limits);
        Assert.Equal(first.Histograms.Copies, second.Histograms.Copies);
        Assert.Equal(first.Measured.StrangersInSamePartBand, second.Measured.StrangersInSamePartBand);
    }

    [Fact]
    public void A_catalogue_without_second_views_calibrates_and_says_siblings_were_not_measured()
    {
        var input = CalibrationInputs.With(catalogue.Input, p => p with { Sku = p.Path });

        var r = new Calibrator(catalogue.Embedder, catalogue.Decoder).Run(input, ReferenceCatalogue.Options with { SampleSize = 4, Edits = [CopyEditKind.Recompress] });

        Assert.Equal(0, r.SkusWithSiblings);
        Assert.Equal(0, r.Measured.SiblingsInSamePartBand.Total);
        Assert.Contains(r.Warnings, w => w.Contains("siblings (second views of one part) were not measured", StringComparison.Ordinal));
        Assert.True(r.Thresholds.Copy < r.Thresholds.SamePart);
    }

    [Fact]
    public void A_photo_changed_since_ingest_is_skipped_with_its_reason()
    {
        string moved = Path.Combine(Path.GetTempPath(), "lookup-calibration-root-" + Guid.NewGuid().ToString("N"));
        CopyTree(catalogue.PhotosRoot, moved);
        try
        {
            var changed = catalogue.Input.Photos[0].Path;
            File.AppendAllText(Path.Combine(moved, changed), "x");
            var input = CalibrationInputs.With(catalogue.Input, p => p, take: 20, root: moved);

            var r = new Calibrator(catalogue.Embedder, catalogue.Decoder).Run(input, ReferenceCatalogue.Options with { SampleSize = 20, Edits = [CopyEditKind.Mirror] });

            var skipped = Assert.Single(r.Skipped);
            Assert.Equal(changed, skipped.Path);
            Assert.Contains("changed since ingest", skipped.Reason, StringComparison.Ordinal);
            Assert.Equal(19, r.Copies);
            Assert.Contains(r.Warnings, w => w.StartsWith("1 of 20 sampled photos got no copies", StringComparison.Ordinal));
        }
        finally
        {
            Directory.Delete(moved, recursive: true);
        }
    }

    private static void CopyTree(string from, string to)
    {
        foreach (string file in Directory.GetFiles(from, "*", SearchOption.AllDirectories))
        {
            string target = Path.Combine(to, Path.GetRelativePath(from, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
            File.SetLastWriteTimeUtc(target, File.GetLastWriteTimeUtc(file));
        }
    }

    private static float HistogramMedian(int[] counts, float binWidth)
    {
        int half = counts.Sum() / 2;
        int running = 0;
        for (int bin = 0; bin < counts.Length; bin++)
        {
            running += counts[bin];
            if (running > half)
            {
                return bin * binWidth;
            }
        }

        return float.NaN;
    }
}

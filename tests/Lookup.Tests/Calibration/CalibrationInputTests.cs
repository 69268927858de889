using System.Globalization;
using Lookup.Calibration;
using Lookup.Store;
using Lookup.Tests.Store;

namespace Lookup.Tests.Calibration;

/// <summary>What calibration reads from an index, and the indexes it refuses with a clear message.</summary>
[Collection(ReferenceCatalogueCollection.Name)]
public sealed class CalibrationInputTests(ReferenceCatalogue catalogue)
{
    [Fact]
    public void Read_takes_every_indexed_photo_with_its_stored_unit_embedding()
    {
        var input = catalogue.Input;

        Assert.Equal(65, input.Photos.Count);
        Assert.Equal(65, input.PhotosIndexed);
        Assert.Equal(55, input.SkuCount);
        Assert.Equal(512, input.Dimension);
        Assert.Equal(Path.GetFullPath(catalogue.PhotosRoot), input.CatalogueRoot);
        Assert.Equal(catalogue.Embedder.Fingerprint, input.ModelFingerprint);
        Assert.Equal(input.Photos.Select(p => p.Path).Order(StringComparer.Ordinal), input.Photos.Select(p => p.Path));
        for (int i = 0; i < input.Photos.Count; i++)
        {
            Assert.Equal(1.0, Math.Sqrt(input.Vector(i).ToArray().Sum(v => (double)v * v)), 3);
        }
    }

    [Fact]
    public void An_index_with_fewer_than_20_photos_is_refused_with_the_count_and_the_fix()
    {
        var input = CalibrationInputs.With(catalogue.Input, p => p, take: 5);

        var e = Assert.Throws<CalibrationException>(() => input.CheckUsable(new CalibrationOptions()));

        Assert.Equal(CalibrationProblem.TooFewPhotos, e.Problem);
        Assert.StartsWith($"{catalogue.IndexPath} holds 5 indexed photos with a SKU; calibrate needs at least 20", e.Message, StringComparison.Ordinal);
        Assert.Contains(string.Create(CultureInfo.InvariantCulture, $"Ingest more photos first; until then match and sweep keep the default thresholds (copy ≤ {VerdictThresholds.Default.Copy:0.000}"), e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_index_with_fewer_than_4_skus_is_refused_because_the_halves_need_two_each()
    {
        var input = CalibrationInputs.With(catalogue.Input, p => p with { Sku = "SKU-" + (p.Path.Length % 3) });

        var e = Assert.Throws<CalibrationException>(() => input.CheckUsable(new CalibrationOptions()));

        Assert.Equal(CalibrationProblem.TooFewSkus, e.Problem);
        Assert.Contains("has photos under 3 SKUs; calibrate needs at least 4", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_catalogue_folder_is_named_in_the_refusal()
    {
        string root = Path.Combine(Path.GetTempPath(), "lookup-not-there-" + Guid.NewGuid().ToString("N"));
        var input = CalibrationInputs.With(catalogue.Input, p => p, root: root);

        var e = Assert.Throws<CalibrationException>(() => input.CheckUsable(new CalibrationOptions()));

        Assert.Equal(CalibrationProblem.CatalogueMissing, e.Problem);
        Assert.StartsWith($"The catalogue folder {root}, which {catalogue.IndexPath} was ingested from, is not there", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Another_model_is_refused_naming_both_fingerprints()
    {
        var e = Assert.Throws<CalibrationException>(() => catalogue.Input.CheckModel(new string('0', 64), "other-net"));

        Assert.Equal(CalibrationProblem.ModelMismatch, e.Problem);
        Assert.Contains(catalogue.Input.ModelFingerprint[..12], e.Message, StringComparison.Ordinal);
        Assert.Contains("the model card 'other-net' gives 000000000000…", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Run_with_another_model_is_refused_before_any_copy_is_made()
    {
        var input = CalibrationInputs.With(catalogue.Input, p => p, fingerprint: new string('f', 64));
        var progress = new List<CalibrationProgress>();

        var e = Assert.Throws<CalibrationException>(() =>
            new Calibrator(catalogue.Embedder, catalogue.Decoder).Run(input, ReferenceCatalogue.Options, new Recorder(progress)));

        Assert.Equal(CalibrationProblem.ModelMismatch, e.Problem);
        Assert.Empty(progress);
    }

    [Fact]
    public void An_index_never_ingested_into_is_refused_with_the_ingest_command()
    {
        using var temp = new TempIndex();
        using (IndexFile.Open(temp.Path, IndexAccess.Write))
        {
        }

        using var file = IndexFile.Open(temp.Path, IndexAccess.Read);
        var e = Assert.Throws<CalibrationException>(() => CalibrationInput.Read(file));

        Assert.Equal(CalibrationProblem.NotIngested, e.Problem);
        Assert.Contains($"run 'lookup ingest PHOTO-TREE --index {temp.Path}' first", e.Message, StringComparison.Ordinal);
    }

    private sealed class Recorder(List<CalibrationProgress> seen) : IProgress<CalibrationProgress>
    {
        public void Report(CalibrationProgress value) => seen.Add(value);
    }
}

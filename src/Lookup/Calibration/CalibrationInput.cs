using System.Globalization;
using Lookup.Store;

namespace Lookup.Calibration;

/// <summary>
/// What calibration needs from an index, read once so the index can be closed while copies are embedded: the
/// indexed photos that have a SKU (sorted by path), their stored embeddings, the catalogue root and the model.
/// </summary>
public sealed class CalibrationInput
{
    /// <summary>Creates the input from parts (tests; <see cref="Read"/> for an index).</summary>
    /// <param name="indexPath">The index, for messages.</param>
    /// <param name="catalogueRoot">Folder the photo paths are relative to.</param>
    /// <param name="modelFingerprint">Fingerprint of the model the stored embeddings come from.</param>
    /// <param name="photos">Indexed photos with a SKU; photo i's embedding is row i of <paramref name="vectors"/>.</param>
    /// <param name="vectors">Unit embeddings, one row of <paramref name="dimension"/> floats per photo.</param>
    /// <param name="dimension">Embedding length.</param>
    /// <param name="photosIndexed">All indexed photos, with or without a SKU (stored with the thresholds).</param>
    /// <param name="current">The thresholds in force now (their margin is kept).</param>
    public CalibrationInput(string indexPath, string catalogueRoot, string modelFingerprint, IReadOnlyList<PhotoRecord> photos, float[] vectors, int dimension, int photosIndexed, VerdictThresholds current)
    {
        ArgumentNullException.ThrowIfNull(photos);
        ArgumentNullException.ThrowIfNull(vectors);
        ArgumentNullException.ThrowIfNull(current);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(dimension);
        if (vectors.Length != photos.Count * dimension || photos.Any(p => string.IsNullOrEmpty(p.Sku)))
        {
            throw new ArgumentException($"Every photo needs a SKU and one row of {dimension} floats ({photos.Count} photos, {vectors.Length} floats).", nameof(vectors));
        }

        IndexPath = indexPath;
        CatalogueRoot = catalogueRoot;
        ModelFingerprint = modelFingerprint;
        Photos = photos;
        Vectors = vectors;
        Dimension = dimension;
        PhotosIndexed = photosIndexed;
        Current = current;
        SkuCount = photos.Select(p => p.Sku).Distinct(StringComparer.Ordinal).Count();
    }

    /// <summary>The index these photos come from.</summary>
    public string IndexPath { get; }

    /// <summary>Folder the photo paths are relative to.</summary>
    public string CatalogueRoot { get; }

    /// <summary>Fingerprint of the model the stored embeddings come from.</summary>
    public string ModelFingerprint { get; }

    /// <summary>Indexed photos that have a SKU, by path.</summary>
    public IReadOnlyList<PhotoRecord> Photos { get; }

    /// <summary>Stored embeddings, row i for photo i.</summary>
    public float[] Vectors { get; }

    /// <summary>Embedding length.</summary>
    public int Dimension { get; }

    /// <summary>All indexed photos, with or without a SKU.</summary>
    public int PhotosIndexed { get; }

    /// <summary>The thresholds in force before this calibration.</summary>
    public VerdictThresholds Current { get; }

    /// <summary>Distinct SKUs among <see cref="Photos"/>.</summary>
    public int SkuCount { get; }

    /// <summary>Photo <paramref name="photo"/>'s stored embedding.</summary>
    public ReadOnlySpan<float> Vector(int photo) => Vectors.AsSpan(photo * Dimension, Dimension);

    /// <summary>Reads the indexed photos, their embeddings and the catalogue settings of <paramref name="file"/>.</summary>
    /// <exception cref="CalibrationException">The index holds no catalogue yet.</exception>
    public static CalibrationInput Read(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        var settings = CatalogueSettings.Read(file);
        var store = new GraphStore(file);
        if (settings is null || !store.HasGraph)
        {
            throw new CalibrationException(CalibrationProblem.NotIngested, $"{file.Path} holds no catalogue yet: run 'lookup ingest PHOTO-TREE --index {file.Path}' first, then calibrate.");
        }

        var graph = store.Load();
        int indexed = 0;
        var photos = new List<PhotoRecord>();
        foreach (var record in new PhotoTable(file).All())
        {
            if (record.Status != PhotoStatus.Indexed)
            {
                continue;
            }

            indexed++;
            if (!string.IsNullOrEmpty(record.Sku) && record.NodeId is int node && node >= 0 && node < graph.Count && !graph.IsDeleted(node))
            {
                photos.Add(record with { Thumbnail = null, Detail = null, Chroma = null });
            }
        }

        photos.Sort((a, b) => string.CompareOrdinal(a.Path, b.Path));
        var vectors = new float[photos.Count * graph.Dimension];
        for (int i = 0; i < photos.Count; i++)
        {
            graph.GetVector(photos[i].NodeId!.Value).CopyTo(vectors.AsSpan(i * graph.Dimension, graph.Dimension));
        }

        return new CalibrationInput(file.Path, settings.CatalogueRoot, store.ModelFingerprint!, photos, vectors, graph.Dimension, indexed, VerdictThresholds.ReadOrDefault(file));
    }

    /// <summary>Refuses an index too small to calibrate, or whose photo files are not where ingest saw them.</summary>
    /// <exception cref="CalibrationException">Too few photos or SKUs, or the catalogue folder is missing.</exception>
    public void CheckUsable(CalibrationOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        string keep = string.Create(CultureInfo.InvariantCulture, $"until then match and sweep keep the {Current.Source} thresholds (copy ≤ {Current.Copy:0.000}, same part ≤ {Current.SamePart:0.000})");
        if (Photos.Count < options.MinPhotos)
        {
            throw new CalibrationException(CalibrationProblem.TooFewPhotos,
                $"{IndexPath} holds {Photos.Count} indexed photos with a SKU; calibrate needs at least {options.MinPhotos} to measure copies and stranger pairs. Ingest more photos first; {keep}.");
        }

        if (SkuCount < options.MinSkus)
        {
            throw new CalibrationException(CalibrationProblem.TooFewSkus,
                $"{IndexPath} has photos under {SkuCount} SKU{(SkuCount == 1 ? "" : "s")}; calibrate needs at least {options.MinSkus}, because it fits the thresholds on half of the SKUs and checks them on the other half. Check the SKU mapping (ingest --sku-from) or ingest more SKUs; {keep}.");
        }

        if (!Directory.Exists(CatalogueRoot))
        {
            throw new CalibrationException(CalibrationProblem.CatalogueMissing,
                $"The catalogue folder {CatalogueRoot}, which {IndexPath} was ingested from, is not there: calibrate makes its copies from the photo files. Mount the catalogue at that path, or ingest it from its new place first.");
        }
    }

    /// <summary>Refuses a model other than the one the stored embeddings come from: copies must be embedded alike.</summary>
    /// <exception cref="CalibrationException">The fingerprints differ.</exception>
    public void CheckModel(string fingerprint, string modelName)
    {
        if (fingerprint != ModelFingerprint)
        {
            throw new CalibrationException(CalibrationProblem.ModelMismatch,
                $"{IndexPath} was built with a model of fingerprint {IndexModelCard.Short(ModelFingerprint)}; the model card '{modelName}' gives {IndexModelCard.Short(fingerprint)}. Copies must be embedded by the index's own model: calibrate without --model (the stored card is used) or with the card the index was built with.");
        }
    }
}

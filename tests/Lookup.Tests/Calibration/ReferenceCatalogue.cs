using Lookup.Calibration;
using Lookup.Catalogue;
using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Store;
using Lookup.Tests.Sweeps;

namespace Lookup.Tests.Calibration;

/// <summary>
/// A small catalogue of open photos, ingested once per test run and calibrated once: every opencv-doc sample photo
/// (Debian opencv-doc, examples/data) and eight scikit-image photos (Debian python3-skimage) under tests/reference-data,
/// each under a SKU of its own, except the ten pairs of one scene, which share a SKU and so give siblings.
/// 65 photos under 55 SKUs.
/// </summary>
public sealed class ReferenceCatalogue : IDisposable
{
    /// <summary>The pairs of one scene (see tests/reference-data/SOURCES.md), filed as two photos of one SKU.</summary>
    public static readonly (string Sku, string[] Files)[] SiblingSkus =
    [
        ("PAIR-graf", ["graf1.png", "graf3.png"]),
        ("PAIR-leuven", ["leuvenA.jpg", "leuvenB.jpg"]),
        ("PAIR-aero", ["aero1.jpg", "aero3.jpg"]),
        ("PAIR-aloe", ["aloeL.jpg", "aloeR.jpg"]),
        ("PAIR-books", ["left.jpg", "right.jpg"]),
        ("PAIR-suzanne", ["Blender_Suzanne1.jpg", "Blender_Suzanne2.jpg"]),
        ("PAIR-basketball", ["basketball1.png", "basketball2.png"]),
        ("PAIR-rubberwhale", ["rubberwhale1.png", "rubberwhale2.png"]),
        ("PAIR-ela", ["ela_original.jpg", "ela_modified.jpg"]),
        ("PAIR-text", ["imageTextN.png", "imageTextR.png"]),
    ];

    /// <summary>The scikit-image photos taken (the folder's other files are format test cases, not photos).</summary>
    public static readonly string[] SkImagePhotos =
        ["astronaut.png", "camera.png", "chelsea.png", "clock_motion.png", "coffee.png", "coins.png", "motorcycle_left.png", "rocket.jpg"];

    private readonly string _work;

    public ReferenceCatalogue()
    {
        _work = Path.Combine(Path.GetTempPath(), "lookup-calibration-" + Guid.NewGuid().ToString("N"));
        PhotosRoot = Path.Combine(_work, "photos");
        BuildTree(PhotosRoot);
        IndexPath = Path.Combine(_work, "reference.lookup");
        Decoder = new PhotoDecoder();
        Embedder = ImageEmbedder.Load(ModelCard.Default);
        using (var file = IndexFile.Open(IndexPath, IndexAccess.Write))
        {
            new CatalogueIngest(file, Embedder).Run(new IngestOptions { Root = PhotosRoot, Workers = 2 });
        }

        using (var file = IndexFile.Open(IndexPath, IndexAccess.Read))
        {
            Input = CalibrationInput.Read(file);
        }

        Result = new Calibrator(Embedder, Decoder).Run(Input, Options);
    }

    /// <summary>
    /// The fixture's calibration: 16 photos, 8 copies each. The target is 1 %, not the default 0.1 %: each half
    /// has about 500 stranger pairs, so 0.1 % of them would be half a pair.
    /// </summary>
    public static CalibrationOptions Options { get; } = new() { SampleSize = 16, Seed = 7, TargetFalseMatchRate = 0.01, Workers = 2 };

    public string PhotosRoot { get; }

    public string IndexPath { get; }

    public PhotoDecoder Decoder { get; }

    public ImageEmbedder Embedder { get; }

    public CalibrationInput Input { get; }

    public CalibrationResult Result { get; }

    /// <summary>A private copy of the ingested (uncalibrated) index, for tests that write.</summary>
    public string CopyOfIndex()
    {
        string path = Path.Combine(_work, "copy-" + Guid.NewGuid().ToString("N") + ".lookup");
        File.Copy(IndexPath, path);
        return path;
    }

    /// <summary>The stored embedding of the photo at <paramref name="relativePath"/> ('/' separated).</summary>
    public float[] StoredVector(string relativePath)
    {
        for (int i = 0; i < Input.Photos.Count; i++)
        {
            if (Input.Photos[i].Path == relativePath)
            {
                return Input.Vector(i).ToArray();
            }
        }

        throw new KeyNotFoundException($"{relativePath} is not in the reference catalogue.");
    }

    /// <summary>Where a reference photo (e.g. "opencv/apple.jpg") sits in the catalogue.</summary>
    public static string CataloguePath(string referencePhoto)
    {
        string name = Path.GetFileName(referencePhoto);
        var pair = SiblingSkus.FirstOrDefault(p => p.Files.Contains(name));
        return (pair.Sku ?? "REF-" + Path.GetFileNameWithoutExtension(name)) + "/" + name;
    }

    public void Dispose()
    {
        Embedder.Dispose();
        try
        {
            Directory.Delete(_work, recursive: true);
        }
        catch (IOException)
        {
            // A handle left open by a failed test; the temp folder is cleaned by the system.
        }
    }

    private static void BuildTree(string root)
    {
        var opencv = Directory.GetFiles(ReferencePhotos.PathOf("opencv")).Select(p => "opencv/" + Path.GetFileName(p));
        foreach (string photo in opencv.Concat(SkImagePhotos.Select(p => "skimage/" + p)))
        {
            string target = Path.Combine(root, CataloguePath(photo));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(ReferencePhotos.PathOf(photo), target);
        }
    }
}

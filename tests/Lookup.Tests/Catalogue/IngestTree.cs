using Lookup.Tests.Imaging;

namespace Lookup.Tests.Catalogue;

/// <summary>
/// A photo tree and an index file beside it (not inside it) in a fresh temporary folder, filled with the open
/// reference photos (tests/reference-data: opencv-doc sample data and scikit-image's data folder, see SOURCES.md).
/// </summary>
internal sealed class IngestTree : IDisposable
{
    /// <summary>
    /// Reference photos with no near copy among them (stereo pairs, sequences and re-exports are left out), so each
    /// one's own embedding finds only itself at distance ≈ 0.
    /// </summary>
    public static readonly string[] Distinct =
    [
        "opencv/LinuxLogo.jpg", "opencv/blox.jpg", "opencv/HappyFish.jpg", "opencv/WindowsLogo.jpg", "opencv/home.jpg",
        "opencv/butterfly.jpg", "opencv/orange.jpg", "opencv/apple.jpg", "opencv/stuff.jpg", "opencv/messi5.jpg",
        "opencv/fruits.jpg", "opencv/baboon.jpg", "opencv/squirrel_cls.jpg", "opencv/board.jpg", "opencv/building.jpg",
        "opencv/text_motion.jpg", "opencv/licenseplate_motion.jpg", "opencv/pca_test1.jpg", "opencv/right.jpg",
        "opencv/aero3.jpg", "opencv/Blender_Suzanne1.jpg", "opencv/box.png", "opencv/cards.png", "opencv/ml.png",
        "opencv/smarties.png", "skimage/rocket.jpg", "skimage/coins.png", "skimage/camera.png",
    ];

    private readonly TempTree _folder = new();

    public IngestTree()
    {
        Root = _folder.Folder("photos");
        IndexPath = _folder.PathOf("parts.lookup");
    }

    /// <summary>The photo tree.</summary>
    public string Root { get; }

    /// <summary>The index file, beside the tree.</summary>
    public string IndexPath { get; }

    /// <summary>A path in the temporary folder outside the tree (for CSV files and the like).</summary>
    public string Outside(string name) => _folder.PathOf(name);

    /// <summary>Absolute path of <paramref name="relative"/> inside the tree.</summary>
    public string PathOf(string relative) => Path.Combine(Root, relative);

    /// <summary>Copies the reference photo <paramref name="reference"/> (e.g. "opencv/apple.jpg") to <paramref name="relative"/>.</summary>
    public string Add(string relative, string reference, DateTime? modified = null) =>
        Write(relative, File.ReadAllBytes(Reference(reference)), modified);

    /// <summary>Writes <paramref name="content"/> at <paramref name="relative"/> with a fixed modification time.</summary>
    public string Write(string relative, byte[] content, DateTime? modified = null) =>
        _folder.File(Path.Combine("photos", relative), content, modified);

    /// <summary>The bytes of a reference photo.</summary>
    public static byte[] Bytes(string reference) => File.ReadAllBytes(Reference(reference));

    /// <summary>Absolute path of a reference photo.</summary>
    public static string Reference(string reference) => Path.Combine(ReferenceData.Root, reference);

    public void Dispose() => _folder.Dispose();
}

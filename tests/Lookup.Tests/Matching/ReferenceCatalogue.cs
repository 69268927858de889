using Lookup.Tests.Imaging;

namespace Lookup.Tests.Matching;

/// <summary>
/// A catalogue made of reference photos (tests/reference-data, see SOURCES.md), each photo its own SKU named after
/// the file, with known right answers for queries: the partner of each opencv-doc pair (the same scene under another
/// viewpoint, light, time or edit), Copydays-style edits of the skimage photos, and opencv-doc photos held out of the
/// catalogue, which must come back as no match. Shared with tools/MatchBench.
/// </summary>
internal static class ReferenceCatalogue
{
    /// <summary>The pairs of the embedding tests plus box.png / box_in_scene.png (the box on a cluttered table); the
    /// first photo is filed, the second is the query.</summary>
    public static readonly (string Filed, string Partner)[] Pairs =
    [
        ("graf1.png", "graf3.png"),
        ("leuvenA.jpg", "leuvenB.jpg"),
        ("aero1.jpg", "aero3.jpg"),
        ("aloeL.jpg", "aloeR.jpg"),
        ("left.jpg", "right.jpg"),
        ("Blender_Suzanne1.jpg", "Blender_Suzanne2.jpg"),
        ("basketball1.png", "basketball2.png"),
        ("rubberwhale1.png", "rubberwhale2.png"),
        ("ela_original.jpg", "ela_modified.jpg"),
        ("imageTextN.png", "imageTextR.png"),
        ("box.png", "box_in_scene.png"),
    ];

    /// <summary>The originals of the copy-detection check (python3-skimage sample photos).</summary>
    public static readonly string[] SkImageOriginals =
    [
        "astronaut.png", "coffee.png", "chelsea.png", "rocket.jpg", "motorcycle_left.png", "camera.png", "coins.png", "clock_motion.png",
    ];

    /// <summary>
    /// Variants of one picture among the other opencv-doc photos (the same logo in two colours, one synthetic drawing
    /// with shapes moved, one page blurred two ways): always filed together, since holding one out would make a
    /// query whose honest answer is its sibling.
    /// </summary>
    public static readonly string[][] Families =
    [
        ["opencv-logo.png", "opencv-logo-white.png"],
        ["pic1.png", "pic3.png", "pic5.png", "pic6.png"],
        ["text_defocus.jpg", "text_motion.jpg"],
    ];

    /// <summary>The SKU a reference photo is filed under: its file name without extension.</summary>
    public static string SkuOf(string fileName) => Path.GetFileNameWithoutExtension(fileName);

    /// <summary>
    /// The opencv-doc photos in no pair and not used as snapshot backgrounds, in name order: the <see cref="Families"/>
    /// are filed, the rest split alternately, even positions filed (distractors), odd positions held out (queries
    /// that must not match).
    /// </summary>
    public static (IReadOnlyList<string> Filed, IReadOnlyList<string> HeldOut) Others()
    {
        var family = Families.SelectMany(f => f).ToHashSet(StringComparer.Ordinal);
        var paired = Pairs.SelectMany(p => new[] { p.Filed, p.Partner }).Concat(BenchSnapshot.Backgrounds).ToHashSet(StringComparer.Ordinal);
        var others = ReferenceData.OpenCvGallery().Select(p => Path.GetFileName(p)).Where(n => !paired.Contains(n)).ToList();
        var single = others.Where(n => !family.Contains(n)).ToList();
        return ([.. others.Where(family.Contains).Concat(single.Where((_, i) => i % 2 == 0)).Order(StringComparer.Ordinal)],
                [.. single.Where((_, i) => i % 2 == 1)]);
    }

    /// <summary>Copies each photo to <paramref name="root"/>/SKU/file, the folder layout ingest maps to SKUs.</summary>
    public static void Write(string root, IEnumerable<string> sourcePaths)
    {
        foreach (var source in sourcePaths)
        {
            var folder = Path.Combine(root, SkuOf(Path.GetFileName(source)));
            Directory.CreateDirectory(folder);
            File.Copy(source, Path.Combine(folder, Path.GetFileName(source)), overwrite: true);
        }
    }

    /// <summary>Full paths of the opencv-doc photos named.</summary>
    public static IEnumerable<string> OpenCv(IEnumerable<string> names) => names.Select(ReferenceData.OpenCv);
}

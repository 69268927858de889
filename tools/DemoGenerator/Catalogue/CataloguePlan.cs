using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Parts;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// Every file the demo consists of, decided from the seed before anything is rendered: catalogue views, the
/// planted defects and the field photos. Cheap to build, so a test can plan the whole catalogue and render
/// a single file of it.
/// </summary>
internal sealed class CataloguePlan
{
    public const int CatalogueSide = 384;
    public const int FieldWidth = 640;
    public const int FieldHeight = 480;
    public const int CatalogueQuality = 90;
    public const int FieldQuality = 80;
    public const int FieldPhotosOfStock = 15;

    /// <summary>Camera presets per view index: base yaw and elevation (radians); the seed jitters both.</summary>
    private static readonly (double Yaw, double Elevation)[] ViewPresets = [(0.5, 0.58), (2.4, 0.86), (-1.1, 0.45), (3.9, 0.7)];

    private CataloguePlan(int seed, List<PlannedPhoto> photos, List<PlannedPhoto> field, List<PlantedDefect> defects)
    {
        Seed = seed;
        Photos = photos;
        Field = field;
        Defects = defects;
    }

    public int Seed { get; }

    /// <summary>Catalogue files (photos/&lt;SKU&gt;/...), planted defects included.</summary>
    public IReadOnlyList<PlannedPhoto> Photos { get; }

    /// <summary>Field photos (field/...), of stocked parts and of strangers.</summary>
    public IReadOnlyList<PlannedPhoto> Field { get; }

    public IReadOnlyList<PlantedDefect> Defects { get; }

    public IEnumerable<PlannedPhoto> All => Photos.Concat(Field);

    public PlannedPhoto Get(string file) =>
        All.FirstOrDefault(p => p.File == file) ?? throw new ArgumentException($"'{file}' is not part of the plan for seed {Seed}.", nameof(file));

    public static CataloguePlan Create(int seed)
    {
        var photos = new List<PlannedPhoto>();
        foreach (var sku in SupplierRange.Skus)
        {
            int views = Math.Min(3, PartShapes.Build(sku).RestPoses.Count);
            for (int v = 0; v < views; v++)
            {
                photos.Add(new PlannedPhoto(PhotoPath(sku.Code, $"{sku.Code}_{v + 1}.jpg"), sku.Code, sku.Code, new RenderRecipe(CatalogueShot(seed, sku, v), CatalogueQuality), $"view {v + 1}"));
            }
        }

        var defects = new List<PlantedDefect>();
        PlantCopy(photos, defects, "HN-M8-ZN", 2, "HN-M10-ZN", "The M8 nut photo was also saved as a photo of the M10 nut.");
        PlantCopy(photos, defects, "VP-80-1G-BO", 1, "VP-80-1G-ZN", "The black pulley photo was reused for the zinc pulley.");
        PlantReExport(photos, defects, "HB-M8x40-ZN", 1, "_web", 75, 256, "Shrunk web copy of view 1 kept beside the original.");
        PlantReExport(photos, defects, "BH-75-BR", 2, "-export", 70, null, "View 2 exported again at a lower JPEG quality.");
        PlantWrongPart(seed, photos, defects, "SG-24T-BO", "VP-60-1G-BO", "A gear photo filed under a pulley.");
        PlantWrongPart(seed, photos, defects, "AB-40-BO", "AB-40-ZN", "The black bracket filed under the zinc one of the same size.");

        return new CataloguePlan(seed, photos, FieldPhotos(seed), defects);
    }

    private static string PhotoPath(string sku, string name) => $"photos/{sku}/{name}";

    private static ShotSpec CatalogueShot(int seed, PartSpec sku, int view)
    {
        var rng = SeededRandom.For(seed, $"{sku.Code}/view{view}");
        var (yaw, elevation) = ViewPresets[view];
        return new ShotSpec(
            Key: $"{sku.Code}/view{view}",
            Seed: seed,
            Part: sku,
            Style: ShotStyle.Studio,
            Pose: view,
            Yaw: yaw + rng.Range(-0.35, 0.35),
            Elevation: elevation + rng.Range(-0.06, 0.06),
            Fill: rng.Range(0.76, 0.84),
            Width: CatalogueSide,
            Height: CatalogueSide);
    }

    private static void PlantCopy(List<PlannedPhoto> photos, List<PlantedDefect> defects, string sku, int view, string otherSku, string note)
    {
        string source = PhotoPath(sku, $"{sku}_{view}.jpg");
        string copy = PhotoPath(otherSku, $"{otherSku}_4.jpg");
        photos.Add(new PlannedPhoto(copy, otherSku, sku, new CopyRecipe(source), note));
        defects.Add(new PlantedDefect(PlantedDefect.SamePhotoTwoSkus, [source, copy], [sku, otherSku], [sku, sku], note));
    }

    private static void PlantReExport(List<PlannedPhoto> photos, List<PlantedDefect> defects, string sku, int view, string suffix, int quality, int? longSide, string note)
    {
        string source = PhotoPath(sku, $"{sku}_{view}.jpg");
        string copy = PhotoPath(sku, $"{sku}_{view}{suffix}.jpg");
        photos.Add(new PlannedPhoto(copy, sku, sku, new ReExportRecipe(source, quality, longSide), note));
        defects.Add(new PlantedDefect(PlantedDefect.ReExportWithinSku, [source, copy], [sku, sku], [sku, sku], note));
    }

    /// <summary>A fresh view (not a copy of any other file) of one part, filed in another SKU's folder.</summary>
    private static void PlantWrongPart(int seed, List<PlannedPhoto> photos, List<PlantedDefect> defects, string actualSku, string filedUnder, string note)
    {
        var shot = CatalogueShot(seed, SupplierRange.Find(actualSku), 3);
        string file = PhotoPath(filedUnder, $"{filedUnder}_4.jpg");
        photos.Add(new PlannedPhoto(file, filedUnder, actualSku, new RenderRecipe(shot, CatalogueQuality), note));
        defects.Add(new PlantedDefect(PlantedDefect.WrongPart, [file], [filedUnder], [actualSku], note));
    }

    private static List<PlannedPhoto> FieldPhotos(int seed)
    {
        var rng = SeededRandom.For(seed, "field");
        var stocked = Shuffle([.. SupplierRange.Skus], rng).Take(FieldPhotosOfStock);
        var subjects = Shuffle([.. stocked.Concat(SupplierRange.Strangers)], rng);
        var field = new List<PlannedPhoto>();
        for (int i = 0; i < subjects.Count; i++)
        {
            var part = subjects[i];
            string file = $"field/bench-{i + 1:00}.jpg";
            var shot = new ShotSpec(
                Key: file,
                Seed: seed,
                Part: part,
                Style: ShotStyle.Field,
                Pose: rng.Next(3),
                Yaw: rng.Range(0, DetMath.TwoPi),
                Elevation: rng.Range(0.6, 1.15),
                Fill: rng.Range(0.28, 0.62),
                Width: FieldWidth,
                Height: FieldHeight);
            bool stockedPart = !part.Code.StartsWith("X-", StringComparison.Ordinal);
            field.Add(new PlannedPhoto(file, null, stockedPart ? part.Code : null, new RenderRecipe(shot, FieldQuality), part.Description));
        }

        return field;
    }

    /// <summary>Fisher–Yates with the seeded generator.</summary>
    private static List<T> Shuffle<T>(List<T> items, SeededRandom rng)
    {
        for (int i = items.Count - 1; i > 0; i--)
        {
            int j = rng.Next(i + 1);
            (items[i], items[j]) = (items[j], items[i]);
        }

        return items;
    }
}

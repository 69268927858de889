using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// A small invented catalogue with known answers (test data only):
/// SKU A: a1, a2 = a1 at half size, a3 = another view of the part (different picture, 0.04 away).
/// SKU B: b1 = the same file as a1 → same photo under A and B: {a1, a2, b1}; b1 against a3 is a look-alike.
/// SKU C: c1, c2 (another view, 0.03). SKU D: d1, a different picture 0.08 from c1 → look-alikes C/D.
/// SKU E: e1, e2 with the same pixels in two files → copies inside E.
/// SKU F: f1–f3 close together, f4 far from them and 0.2 from g1 of SKU G → f4 is far from its SKU.
/// SKU G: g1, g2. SKU H: h1, h2 at 0.3 from each other and nothing near: two plain views, nothing to report.
/// </summary>
internal static class SyntheticCatalogue
{
    public static List<SweepPhoto> Build()
    {
        var random = new Random(2024);
        var photos = new List<SweepPhoto>();
        var id = 100;
        SweepPhoto Add(string sku, string name, Image<SixLabors.ImageSharp.PixelFormats.Rgb24> image, float[] v, byte[]? bytes = null)
        {
            var photo = SweepFixtures.Photo(id++, sku, $"{sku}/{name}", image, v, bytes);
            photos.Add(photo);
            return photo;
        }

        using var ta = SweepFixtures.Texture(1, 320, 240);
        using var taHalf = ta.Clone(c => c.Resize(160, 120));
        using var ta3 = SweepFixtures.Texture(2, 320, 240);
        var va = SweepFixtures.RandomUnit(random);
        var a1 = Add("A", "a1.png", ta, va);
        Add("A", "a2.png", taHalf, SweepFixtures.Near(va, 0.02, random));
        Add("A", "a3.png", ta3, SweepFixtures.Near(va, 0.04, random));
        photos.Add(a1 with { Id = id++, Sku = "B", Path = "B/b1.png" });

        using var tc = SweepFixtures.Texture(3);
        using var tc2 = SweepFixtures.Texture(4);
        using var td = SweepFixtures.Texture(5);
        var vc = SweepFixtures.RandomUnit(random);
        Add("C", "c1.png", tc, vc);
        Add("C", "c2.png", tc2, SweepFixtures.Near(vc, 0.03, random));
        Add("D", "d1.png", td, SweepFixtures.Near(vc, 0.08, random));

        using var te = SweepFixtures.Texture(6);
        var ve = SweepFixtures.RandomUnit(random);
        Add("E", "e1.png", te, ve);
        Add("E", "e2.png", te, ve, [.. SweepFixtures.EncodePng(te), 1, 2, 3]);

        var vf = SweepFixtures.RandomUnit(random);
        var vg = SweepFixtures.RandomUnit(random);
        for (var k = 1; k <= 3; k++)
        {
            using var tf = SweepFixtures.Texture(10 + k);
            Add("F", $"f{k}.png", tf, SweepFixtures.Near(vf, 0.02, random));
        }

        using var tf4 = SweepFixtures.Texture(14);
        using var tg1 = SweepFixtures.Texture(15);
        using var tg2 = SweepFixtures.Texture(16);
        Add("F", "f4.png", tf4, SweepFixtures.Near(vg, 0.2, random));
        Add("G", "g1.png", tg1, vg);
        Add("G", "g2.png", tg2, SweepFixtures.Near(vg, 0.03, random));

        using var th1 = SweepFixtures.Texture(17);
        using var th2 = SweepFixtures.Texture(18);
        var vh = SweepFixtures.RandomUnit(random);
        Add("H", "h1.png", th1, vh);
        Add("H", "h2.png", th2, SweepFixtures.Near(vh, 0.3, random));
        return photos;
    }

    public static string[] Paths(SweepFinding finding) => [.. finding.Members.Select(m => m.Path).Order(StringComparer.Ordinal)];
}

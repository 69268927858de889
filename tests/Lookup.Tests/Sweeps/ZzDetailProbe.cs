using System.Text.Json;
using Lookup.Sweeps;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using Xunit.Abstractions;

namespace Lookup.Tests.Sweeps;

public sealed class ZzDetailProbe(ITestOutputHelper output)
{
    [Fact]
    public void Probe()
    {
        var demo = Path.GetFullPath(Path.Combine(ReferencePhotos.PathOf("x"), "..", "..", "..", "demo-catalogue"));
        var truth = JsonDocument.Parse(File.ReadAllText(Path.Combine(demo, "truth.json")));
        var copies = new HashSet<(string, string)>();
        foreach (var d in truth.RootElement.GetProperty("defects").EnumerateArray())
        {
            var kind = d.GetProperty("kind").GetString();
            if (kind is "same-photo-two-skus" or "re-export-within-sku")
            {
                var f = d.GetProperty("files").EnumerateArray().Select(x => x.GetString()!).ToArray();
                copies.Add((f[0], f[1]));
                copies.Add((f[1], f[0]));
            }
        }

        var photos = new List<SweepPhoto>();
        var id = 0;
        foreach (var line in File.ReadAllLines(Path.Combine(demo, "catalogue.csv")).Skip(1))
        {
            var parts = line.Split(',');
            var bytes = File.ReadAllBytes(Path.Combine(demo, parts[0]));
            using var image = Image.Load<Rgb24>(bytes);
            photos.Add(SweepFixtures.Photo(id++, parts[1], parts[0], image, [1f], bytes));
        }

        var classifier = new PairClassifier(new SweepOptions());
        var comparer = new DetailComparer();
        var chroma = new ChromaComparer();
        var lines = new List<string>();
        for (var i = 0; i < photos.Count; i++)
        {
            for (var j = i + 1; j < photos.Count; j++)
            {
                var (a, b) = (photos[i], photos[j]);
                var (rel, ev) = classifier.Classify(a, a.Thumbnail, b, b.Thumbnail, 0.05f);
                if (rel < PairRelation.Copy)
                {
                    continue;
                }

                var isCopy = copies.Contains((a.Path, b.Path));
                var h = ev.Alignment;
                var (c, t) = ContainerIsA(a, b, ev) ? (a, b) : (b, a);
                var d0 = comparer.Correlate(c.Detail!, PhotoShape.Of(c), t.Detail!, PhotoShape.Of(t), h, 0);
                var d12 = comparer.Correlate(c.Detail!, PhotoShape.Of(c), t.Detail!, PhotoShape.Of(t), h, 12);
                lines.Add($"{(isCopy ? "COPY " : "false")} {d0:0.000} {d12:0.000} corr {ev.Correlation:0.000} {C(chroma, c, t, ev.Alignment)} {rel} {ev.Edits} {a.Path} {b.Path}");
            }
        }

        foreach (var l in lines.OrderBy(l => l[^80..]))
        {
            output.WriteLine(l);
        }

        foreach (var source in ReferencePhotos.Sources)
        {
            var original = File.ReadAllBytes(ReferencePhotos.PathOf(source));
            using var image = Image.Load<Rgb24>(original);
            var a = SweepFixtures.Photo(1, "A", source, image, [1f], original);
            foreach (var (edit, _, _) in PlantedEdits.All)
            {
                var bytes = PlantedEdits.Apply(edit, image, original);
                using var edited = Image.Load<Rgb24>(bytes);
                var b = SweepFixtures.Photo(2, "B", source, edited, [1f], bytes);
                var (rel, ev) = classifier.Classify(a, a.Thumbnail, b, b.Thumbnail, 0.05f);
                var (c, t) = ContainerIsA(a, b, ev) ? (a, b) : (b, a);
                var d0 = comparer.Correlate(c.Detail!, PhotoShape.Of(c), t.Detail!, PhotoShape.Of(t), ev.Alignment, 0);
                var d12 = comparer.Correlate(c.Detail!, PhotoShape.Of(c), t.Detail!, PhotoShape.Of(t), ev.Alignment, 12);
                output.WriteLine($"REF {d0:0.000} {d12:0.000} corr {ev.Correlation:0.000} {C(chroma, c, t, ev.Alignment)} {rel} {ev.Edits} {source} {edit}");
            }
        }

        foreach (var (first, second) in ReferencePhotos.SecondViews)
        {
            var ba = File.ReadAllBytes(ReferencePhotos.PathOf(first));
            var bb = File.ReadAllBytes(ReferencePhotos.PathOf(second));
            using var ia = Image.Load<Rgb24>(ba);
            using var ib = Image.Load<Rgb24>(bb);
            var a = SweepFixtures.Photo(1, "A", first, ia, [1f], ba);
            var b = SweepFixtures.Photo(2, "A", second, ib, [1f], bb);
            var (rel, ev) = classifier.Classify(a, a.Thumbnail, b, b.Thumbnail, 0.05f);
            var (c, t) = ContainerIsA(a, b, ev) ? (a, b) : (b, a);
            var d0 = comparer.Correlate(c.Detail!, PhotoShape.Of(c), t.Detail!, PhotoShape.Of(t), ev.Alignment, 0);
            var d12 = comparer.Correlate(c.Detail!, PhotoShape.Of(c), t.Detail!, PhotoShape.Of(t), ev.Alignment, 12);
            output.WriteLine($"VIEW {d0:0.000} {d12:0.000} corr {ev.Correlation:0.000} {C(chroma, c, t, ev.Alignment)} {rel} {first} {second}");
        }
    }

    private static string C(ChromaComparer chroma, SweepPhoto c, SweepPhoto t, AlignmentHypothesis h)
    {
        var (s1, s2, r) = chroma.Compare(c.Chroma!, PhotoShape.Of(c), t.Chroma!, PhotoShape.Of(t), h);
        return $"chroma {s1:0.0} {s2:0.0} {r:0.00}";
    }

    // The classifier does not expose which side was the container; whole frames use A as container.
    private static bool ContainerIsA(SweepPhoto a, SweepPhoto b, PairEvidence ev) => (double)a.Width * a.Height >= (double)b.Width * b.Height;
}

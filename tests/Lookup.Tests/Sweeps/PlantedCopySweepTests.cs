using System.Security.Cryptography;
using Lookup.Imaging;
using Lookup.Sweeps;
using Lookup.Tests.Embedding;
using SixLabors.ImageSharp.PixelFormats;
using Xunit.Abstractions;

namespace Lookup.Tests.Sweeps;

/// <summary>
/// The whole sweep on real photos with the real ResNet18 embedder: the reference photos (tests/reference-data, see its
/// SOURCES.md) each under their own SKU, the planted copies of <see cref="PlantedEdits"/> beside them (the byte copy
/// of every second source under another SKU), and the second views of <see cref="ReferencePhotos.SecondViews"/> each
/// pair under one SKU. Ground truth: two photos are the same photo exactly when they come from the same source.
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class PlantedCopySweepTests(EmbedderFixture embedder, ITestOutputHelper output)
{
    [Fact]
    public void Sweep_finds_every_planted_copy_with_its_kind_and_calls_no_second_view_a_copy()
    {
        var (photos, sourceOf, editOf) = Catalogue();

        var report = SweepEngine.Run(photos, new ExactNeighbourSource(photos));

        var relation = report.Findings.SelectMany(f => f.Pairs.Select(p => (Pair: Key(p.FirstPhotoId, p.SecondPhotoId), Finding: f, p)))
            .ToDictionary(x => x.Pair, x => (x.Finding, x.p));
        var (truePositives, predicted, truth) = (0, 0, 0);
        var misses = new List<string>();
        for (var i = 0; i < photos.Count; i++)
        {
            for (var j = i + 1; j < photos.Count; j++)
            {
                var (a, b) = (photos[i], photos[j]);
                var same = sourceOf[a.Id] >= 0 && sourceOf[a.Id] == sourceOf[b.Id];
                var said = relation.TryGetValue(Key(a.Id, b.Id), out var found) && found.p.Relation >= PairRelation.Copy;
                truth += same ? 1 : 0;
                predicted += said ? 1 : 0;
                truePositives += same && said ? 1 : 0;
            }
        }

        // Each planted copy against its own original: the relation, the edit and the finding's kind.
        foreach (var copy in photos.Where(p => editOf.ContainsKey(p.Id)))
        {
            var (edit, expectedRelation, expectedEdits) = editOf[copy.Id];
            var original = photos.First(p => sourceOf[p.Id] == sourceOf[copy.Id]);
            var distance = 1 - copy.Embedding.Span.ToArray().Zip(original.Embedding.ToArray(), (x, y) => x * y).Sum();
            var ok = relation.TryGetValue(Key(original.Id, copy.Id), out var found)
                && found.p.Relation == expectedRelation && found.p.Evidence.Edits == expectedEdits
                && found.Finding.Kind == (sourceOf[copy.Id] % 2 == 1 ? FindingKind.SamePhotoSeveralSkus : FindingKind.CopiesInOneSku);
            output.WriteLine($"{original.Path,-24} {edit,-17} distance {distance:0.0000} → {(found.p is null ? "not paired" : $"{found.p.Relation} {found.p.Evidence.Edits}, {found.Finding.Kind}")}");
            if (!ok)
            {
                misses.Add($"{original.Path} {edit}");
            }
        }

        var falseCopies = photos.Where(p => sourceOf[p.Id] < 0).SelectMany(p => relation.Where(r => (r.Key.Item1 == p.Id || r.Key.Item2 == p.Id) && r.Value.p.Relation >= PairRelation.Copy)).ToList();
        foreach (var (first, second) in ReferencePhotos.SecondViews)
        {
            var (a, b) = (photos.Single(p => p.Path.EndsWith(first, StringComparison.Ordinal)), photos.Single(p => p.Path.EndsWith(second, StringComparison.Ordinal)));
            var distance = 1 - a.Embedding.Span.ToArray().Zip(b.Embedding.ToArray(), (x, y) => x * y).Sum();
            output.WriteLine($"second views {first} / {second}: distance {distance:0.0000}");
        }

        output.WriteLine($"same-photo pairs: precision {truePositives}/{predicted}, recall {truePositives}/{truth}; findings by kind: " +
            string.Join(", ", report.FindingsByKind.Select(k => $"{k.Key} {k.Value}")));
        Assert.Empty(misses);
        Assert.Empty(falseCopies);
        Assert.Equal(predicted, truePositives);
    }

    private static (int, int) Key(int a, int b) => a < b ? (a, b) : (b, a);

    private (List<SweepPhoto> Photos, Dictionary<int, int> SourceOf, Dictionary<int, (string, PairRelation, CopyEdits)> EditOf) Catalogue()
    {
        var photos = new List<SweepPhoto>();
        var sourceOf = new Dictionary<int, int>();
        var editOf = new Dictionary<int, (string, PairRelation, CopyEdits)>();
        for (var s = 0; s < ReferencePhotos.Sources.Length; s++)
        {
            var path = ReferencePhotos.Sources[s];
            var bytes = File.ReadAllBytes(ReferencePhotos.PathOf(path));
            sourceOf[Add(photos, $"S{s}", path, bytes).Id] = s;
            using var decoded = embedder.Decoder.Decode(bytes, path);
            foreach (var (edit, relation, edits) in PlantedEdits.All)
            {
                var sku = edit == "byte copy" && s % 2 == 1 ? $"S{s}-other" : $"S{s}";
                var copy = Add(photos, sku, $"{path} ({edit})", PlantedEdits.Apply(edit, decoded.Image, bytes));
                sourceOf[copy.Id] = s;
                editOf[copy.Id] = (edit, relation, edits);
            }
        }

        for (var v = 0; v < ReferencePhotos.SecondViews.Length; v++)
        {
            foreach (var path in new[] { ReferencePhotos.SecondViews[v].Item1, ReferencePhotos.SecondViews[v].Item2 })
            {
                sourceOf[Add(photos, $"V{v}", path, File.ReadAllBytes(ReferencePhotos.PathOf(path))).Id] = -1;
            }
        }

        return (photos, sourceOf, editOf);
    }

    private SweepPhoto Add(List<SweepPhoto> photos, string sku, string path, byte[] bytes)
    {
        using var decoded = embedder.Decoder.Decode(bytes, path);
        using var grey = decoded.Image.CloneAs<L8>();
        var pixels = new byte[decoded.Image.Width * decoded.Image.Height];
        grey.CopyPixelDataTo(pixels);
        var photo = new SweepPhoto(
            photos.Count, sku, $"{sku}/{path}", Convert.ToHexStringLower(SHA256.HashData(bytes)), DifferenceHash.Compute(decoded.Image),
            decoded.Image.Width, decoded.Image.Height, bytes.Length, embedder.EmbedBytes(bytes, path),
            GreyThumbnail.FromGrey(pixels, decoded.Image.Width, decoded.Image.Height));
        photos.Add(photo);
        return photo;
    }
}

using Lookup.Calibration;
using Lookup.Tests.Graph;

namespace Lookup.Tests.Calibration;

/// <summary>
/// Stranger and sibling distances of the 2,000 committed Fashion-MNIST test embeddings (Xiao, Rasul &amp; Vollgraf
/// 2017; Debian dataset-fashion-mnist; ResNet18 vectors in tests/reference-data/fashion-mnist), split in halves
/// the way calibrate splits a catalogue.
/// </summary>
internal static class FashionMnistPairs
{
    /// <summary>Each image a product (SKU) of its own: every pair is a stranger pair, look-alikes of one class included.</summary>
    public static (DistanceSet Fit, DistanceSet HeldOut) EachImageItsOwnSku(FashionMnistEmbeddings fashion, int seed) =>
        Halves(fashion, Enumerable.Range(0, fashion.Vectors.Length).Select(i => $"item-{i:0000}").ToList(), seed);

    /// <summary>Each class a SKU: same-class pairs are siblings, other pairs strangers.</summary>
    public static (DistanceSet Fit, DistanceSet HeldOut) ClassesAsSkus(FashionMnistEmbeddings fashion, int seed) =>
        Halves(fashion, fashion.Labels.Select(l => $"class-{l}").ToList(), seed);

    public static float[] Flatten(float[][] rows) => rows.SelectMany(r => r).ToArray();

    private static (DistanceSet, DistanceSet) Halves(FashionMnistEmbeddings fashion, List<string> skus, int seed)
    {
        var groups = PhotoGroups.Of(skus, new string?[skus.Count]);
        var heldOut = SkuHalves.Split(groups.SkuCount, seed);
        var sampler = new PairSampler(Flatten(fashion.Vectors), fashion.Vectors[0].Length, groups);
        var random = new Random(seed);
        DistanceSet Half(bool held)
        {
            var members = SkuHalves.Members(groups, heldOut, held);
            return new DistanceSet([], sampler.Siblings(members, 250_000, random), sampler.Strangers(members, 250_000, random));
        }

        return (Half(false), Half(true));
    }
}

using Lookup.Calibration;
using Lookup.Graph;
using Lookup.Tests.Graph;

namespace Lookup.Tests.Calibration;

public sealed class PairSamplerTests(FashionMnistEmbeddings fashion) : IClassFixture<FashionMnistEmbeddings>
{
    private const int Images = 80;

    // The first 80 Fashion-MNIST test images with their classes as SKUs; images 0 and 1 are given one content hash,
    // as if the same file had been filed twice.
    private (PairSampler Sampler, PhotoGroups Groups, float[] Vectors) Setup()
    {
        var skus = fashion.Labels.Take(Images).Select(l => $"class-{l}").ToList();
        var hashes = Enumerable.Range(0, Images).Select(i => i <= 1 ? "same-bytes" : $"hash-{i}").ToList();
        var groups = PhotoGroups.Of(skus, hashes);
        var vectors = FashionMnistPairs.Flatten(fashion.Vectors.Take(Images).ToArray());
        return (new PairSampler(vectors, 512, groups), groups, vectors);
    }

    [Fact]
    public void Strangers_are_every_pair_of_different_skus_and_contents_when_few()
    {
        var (sampler, groups, vectors) = Setup();
        var members = Enumerable.Range(0, Images).ToArray();

        var strangers = sampler.Strangers(members, 1_000_000, new Random(1));

        var expected = BruteForce(groups, vectors, (i, j) => groups.Sku[i] != groups.Sku[j] && groups.Content[i] != groups.Content[j]);
        Assert.Equal(expected, strangers);
    }

    [Fact]
    public void Siblings_are_every_pair_within_one_sku_except_equal_contents()
    {
        var (sampler, groups, vectors) = Setup();
        var members = Enumerable.Range(0, Images).ToArray();

        var siblings = sampler.Siblings(members, 1_000_000, new Random(1));

        var expected = BruteForce(groups, vectors, (i, j) => groups.Sku[i] == groups.Sku[j] && groups.Content[i] != groups.Content[j]);
        Assert.Equal(expected, siblings);
        Assert.True(siblings.Length > 100);
    }

    [Fact]
    public void Above_the_cap_pairs_are_drawn_from_the_allowed_ones_only()
    {
        var (sampler, groups, vectors) = Setup();
        var members = Enumerable.Range(0, Images).ToArray();
        var strangerSet = BruteForce(groups, vectors, (i, j) => groups.Sku[i] != groups.Sku[j] && groups.Content[i] != groups.Content[j]).ToHashSet();
        var siblingSet = BruteForce(groups, vectors, (i, j) => groups.Sku[i] == groups.Sku[j] && groups.Content[i] != groups.Content[j]).ToHashSet();

        var strangers = sampler.Strangers(members, 200, new Random(3));
        var siblings = sampler.Siblings(members, 50, new Random(3));

        Assert.Equal(200, strangers.Length);
        Assert.Equal(50, siblings.Length);
        Assert.All(strangers, d => Assert.Contains(d, strangerSet));
        Assert.All(siblings, d => Assert.Contains(d, siblingSet));
        Assert.Equal(strangers.Order(), strangers);
    }

    [Fact]
    public void Halves_split_the_skus_alternately_so_each_half_has_two_of_four()
    {
        var heldOut = SkuHalves.Split(4, seed: 9);

        Assert.Equal(2, heldOut.Count(h => h));
        Assert.Equal(heldOut, SkuHalves.Split(4, seed: 9));
    }

    private static float[] BruteForce(PhotoGroups groups, float[] vectors, Func<int, int, bool> take)
    {
        var distances = new List<float>();
        for (int i = 0; i < Images; i++)
        {
            for (int j = i + 1; j < Images; j++)
            {
                if (take(i, j))
                {
                    distances.Add(CosineKernel.Distance(vectors.AsSpan(i * 512, 512), vectors.AsSpan(j * 512, 512)));
                }
            }
        }

        return distances.Order().ToArray();
    }
}

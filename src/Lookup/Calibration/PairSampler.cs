using Lookup.Graph;

namespace Lookup.Calibration;

/// <summary>
/// Distances between stored embeddings: strangers (photos of different SKUs) and siblings (different photos of one
/// SKU), among a given set of photos. Every pair is taken when there are at most <c>maxPairs</c>; otherwise that
/// many are drawn at random (with replacement, uniformly over the allowed pairs). Pairs of equal content (byte
/// copies) are left out of both. Results are sorted ascending.
/// </summary>
internal sealed class PairSampler(float[] vectors, int dimension, PhotoGroups groups)
{
    public float[] Strangers(int[] members, int maxPairs, Random random)
    {
        long sameSku = BySku(members).Sum(g => (long)g.Length * (g.Length - 1) / 2);
        long all = (long)members.Length * (members.Length - 1) / 2;
        var distances = new List<float>((int)Math.Min(all - sameSku, maxPairs));
        if (all - sameSku <= maxPairs)
        {
            for (int a = 0; a < members.Length; a++)
            {
                for (int b = a + 1; b < members.Length; b++)
                {
                    AddStranger(members[a], members[b], distances);
                }
            }
        }
        else
        {
            long attempts = 50L * maxPairs;
            while (distances.Count < maxPairs && attempts-- > 0)
            {
                AddStranger(members[random.Next(members.Length)], members[random.Next(members.Length)], distances);
            }
        }

        return Sorted(distances);
    }

    public float[] Siblings(int[] members, int maxPairs, Random random)
    {
        var skus = BySku(members).Where(g => g.Length > 1).ToArray();
        long total = skus.Sum(g => (long)g.Length * (g.Length - 1) / 2);
        var distances = new List<float>((int)Math.Min(total, maxPairs));
        if (total <= maxPairs)
        {
            foreach (var photos in skus)
            {
                for (int a = 0; a < photos.Length; a++)
                {
                    for (int b = a + 1; b < photos.Length; b++)
                    {
                        AddSibling(photos[a], photos[b], distances);
                    }
                }
            }
        }
        else
        {
            // Each pair equally likely: pick a SKU in proportion to its pairs, then a pair inside it.
            var cumulative = new long[skus.Length];
            long running = 0;
            for (int s = 0; s < skus.Length; s++)
            {
                running += (long)skus[s].Length * (skus[s].Length - 1) / 2;
                cumulative[s] = running;
            }

            long attempts = 50L * maxPairs;
            while (distances.Count < maxPairs && attempts-- > 0)
            {
                int s = Array.BinarySearch(cumulative, random.NextInt64(running) + 1);
                var photos = skus[s < 0 ? ~s : s];
                int a = random.Next(photos.Length);
                int b = random.Next(photos.Length - 1);
                AddSibling(photos[a], photos[b >= a ? b + 1 : b], distances);
            }
        }

        return Sorted(distances);
    }

    private void AddStranger(int i, int j, List<float> distances)
    {
        if (groups.Sku[i] != groups.Sku[j] && groups.Content[i] != groups.Content[j])
        {
            distances.Add(Distance(i, j));
        }
    }

    private void AddSibling(int i, int j, List<float> distances)
    {
        if (groups.Content[i] != groups.Content[j])
        {
            distances.Add(Distance(i, j));
        }
    }

    private float Distance(int i, int j) =>
        CosineKernel.Distance(vectors.AsSpan(i * dimension, dimension), vectors.AsSpan(j * dimension, dimension));

    private IEnumerable<int[]> BySku(int[] members) =>
        members.GroupBy(i => groups.Sku[i]).Select(g => g.ToArray());

    private static float[] Sorted(List<float> distances)
    {
        var array = distances.ToArray();
        Array.Sort(array);
        return array;
    }
}

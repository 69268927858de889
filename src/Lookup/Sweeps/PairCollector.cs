using System.Collections.Concurrent;

namespace Lookup.Sweeps;

/// <summary>
/// Asks the neighbour source for every photo's neighbours within the sweep radius, in parallel with one result buffer
/// per thread, and returns each unordered pair once. A pair found from either side is kept, so an approximate source
/// that finds it from one side only loses nothing. O(n) queries plus a sort of the pairs.
/// </summary>
internal static class PairCollector
{
    public static PhotoPair[] Collect(
        IReadOnlyList<SweepPhoto> photos,
        IReadOnlyDictionary<int, int> indexOfId,
        INeighbourSource source,
        float radius,
        ParallelOptions parallel)
    {
        var chunks = new ConcurrentBag<List<long>>();
        Parallel.For(
            0,
            photos.Count,
            parallel,
            () => (Found: new List<SweepNeighbour>(), Pairs: new List<long>()),
            (i, _, local) =>
            {
                local.Found.Clear();
                source.FindWithin(photos[i].Id, radius, local.Found);
                foreach (var neighbour in local.Found)
                {
                    if (indexOfId.TryGetValue(neighbour.PhotoId, out var j) && j != i)
                    {
                        local.Pairs.Add(new PhotoPair(Math.Min(i, j), Math.Max(i, j)).Packed);
                    }
                }

                return local;
            },
            local => chunks.Add(local.Pairs));

        var all = new long[chunks.Sum(c => c.Count)];
        var at = 0;
        foreach (var chunk in chunks)
        {
            chunk.CopyTo(all, at);
            at += chunk.Count;
        }

        Array.Sort(all);
        var unique = new List<PhotoPair>(all.Length / 2);
        for (var k = 0; k < all.Length; k++)
        {
            if (k == 0 || all[k] != all[k - 1])
            {
                unique.Add(PhotoPair.Unpack(all[k]));
            }
        }

        return [.. unique];
    }
}

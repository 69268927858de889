using System.Numerics;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Matching;

/// <summary>Exact scoring of one candidate SKU against the query photos.</summary>
internal sealed partial class SkuRanker
{
    private SkuScore? Score(string sku, IReadOnlyList<QueryPhoto> photos, HashSet<int>? hitNodes, PhotoRecord? identical, IReadOnlySet<int> exclude)
    {
        var members = catalogue.PhotosOf(sku).Where(r => !exclude.Contains(r.NodeId!.Value)).ToList();
        int photosInSku = members.Count;
        if (members.Count > options.MaxPhotosScoredPerSku)
        {
            members = [.. members.Where(r => (hitNodes?.Contains(r.NodeId!.Value) ?? false) || r.Path == identical?.Path)];
        }

        if (members.Count == 0)
        {
            return null;
        }

        var memberBest = new float[members.Count];
        Array.Fill(memberBest, float.PositiveInfinity);
        float whole = float.PositiveInfinity;
        int wholeMember = 0, wholePhoto = 0;
        for (int m = 0; m < members.Count; m++)
        {
            var vector = catalogue.Vector(members[m].NodeId!.Value);
            for (int p = 0; p < photos.Count; p++)
            {
                var crops = photos[p].Crops;
                for (int c = 0; c < crops.Length; c++)
                {
                    float d = CosineKernel.Distance(crops[c], vector);
                    memberBest[m] = Math.Min(memberBest[m], d);
                    if (c == 0 && d < whole)
                    {
                        (whole, wholeMember, wholePhoto) = (d, m, p);
                    }
                }
            }
        }

        int matched = memberBest.Count(d => d <= thresholds.SamePart);
        if (identical is not null)
        {
            return new SkuScore(sku, 0f, 0f, 0, true, identical, Math.Max(matched, 1), photosInSku);
        }

        int best = Array.IndexOf(memberBest, memberBest.Min());

        int? hashBits = photos[wholePhoto].DifferenceHash is ulong hash
            ? BitOperations.PopCount(hash ^ members[wholeMember].DHash)
            : null;
        return new SkuScore(sku, memberBest[best], whole, hashBits, false, members[best], matched, photosInSku);
    }
}

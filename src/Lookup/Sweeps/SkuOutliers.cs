using System.Collections.Concurrent;
using System.Numerics.Tensors;

namespace Lookup.Sweeps;

/// <summary>
/// Finds photos that sit far from the rest of their SKU and nearer to another SKU: likely filed under the wrong SKU.
/// For each photo of a SKU with two or more photos, its distance to the nearest other photo of the SKU; a candidate
/// is at least <see cref="SweepOptions.OutlierMinDistance"/> away and, in a SKU of three or more, at least
/// <see cref="SweepOptions.OutlierSpreadFactor"/> times the SKU's median of those distances. A candidate is reported
/// only if a photo of another SKU is nearer than its own SKU. In a SKU of two photos neither is typical, so the one
/// with the nearer other-SKU photo is the one reported. A SKU where more than half the photos are candidates has no
/// core to be far from and is left alone.
/// <para>
/// Finish check (only when the finishes of the photos are known, see <see cref="FinishSignature"/>): a photo whose
/// finish differs from every other photo of its SKU by at least <see cref="FinishMinDifference"/> is reported when a
/// photo of another SKU is nearer than its nearest own photo and has its finish (difference at most
/// <see cref="FinishMatchMaxDifference"/>). This catches a part filed under the same shape in another finish (a black
/// bracket under the zinc one), which can sit right in the middle of its SKU by distance: the network barely tells
/// finishes apart. Needs a SKU of three or more (two siblings that agree), and is skipped when more than half of the
/// SKU would be candidates. The same evidence also withdraws a distance flag when the photo's finish is plainly not
/// the other SKU's and much closer to its own SKU's.
/// </para>
/// Cost: O(k² · dim) for a SKU of k ≤ 256 photos; larger SKUs are screened by the distance to the mean of the
/// others (O(k · dim)), then each candidate's nearest own photo is found exactly.
/// </summary>
internal static class SkuOutliers
{
    /// <summary>
    /// Least finish difference to every sibling for the finish check: above the largest difference between two
    /// photos of one SKU on the demo catalogue's studio photos (2.3, brass in a bright and a dim pose).
    /// </summary>
    public const double FinishMinDifference = 2.5;

    /// <summary>
    /// Most finish difference to the other SKU's photo for the finish check: about the median difference between a
    /// photo and its nearest sibling of one SKU on the demo catalogue (0.7), rounded up.
    /// </summary>
    public const double FinishMatchMaxDifference = 1.0;

    private const int ExactLimit = 256;

    public static List<SweepFinding> Find(
        IReadOnlyList<SweepPhoto> photos,
        IReadOnlyDictionary<int, int> indexOfId,
        INeighbourSource source,
        SweepOptions options,
        ParallelOptions parallel,
        IReadOnlyList<FinishSignature?>? finishes = null)
    {
        var skus = Enumerable.Range(0, photos.Count)
            .GroupBy(i => photos[i].Sku, StringComparer.Ordinal)
            .Select(g => g.ToArray())
            .Where(g => g.Length >= 2)
            .ToArray();
        var found = new ConcurrentBag<SweepFinding>();
        Parallel.For(
            0,
            skus.Length,
            parallel,
            () => new List<SweepNeighbour>(),
            (s, _, buffer) =>
            {
                var reported = new HashSet<int>();
                foreach (var finding in InSku(photos, indexOfId, source, options, skus[s], buffer, reported, finishes))
                {
                    found.Add(finding);
                }

                if (finishes is not null)
                {
                    foreach (var finding in FinishOutliers(photos, indexOfId, source, options, skus[s], buffer, reported, finishes))
                    {
                        found.Add(finding);
                    }
                }

                return buffer;
            },
            _ => { });
        return [.. found];
    }

    private static List<SweepFinding> InSku(
        IReadOnlyList<SweepPhoto> photos,
        IReadOnlyDictionary<int, int> indexOfId,
        INeighbourSource source,
        SweepOptions options,
        int[] members,
        List<SweepNeighbour> buffer,
        HashSet<int> reported,
        IReadOnlyList<FinishSignature?>? finishes)
    {
        var k = members.Length;
        var screen = k <= ExactLimit ? NearestOwn(photos, members) : DistanceToRest(photos, members);
        float? spread = k >= 3 ? Median(screen) : null;
        var bar = Math.Max(options.OutlierMinDistance, spread is { } m ? options.OutlierSpreadFactor * m : 0f);
        var candidates = Enumerable.Range(0, k).Where(i => screen[i] >= bar).ToList();
        if (candidates.Count == 0 || (k >= 3 && candidates.Count > k / 2))
        {
            return [];
        }

        var flagged = new List<(int Member, int Own, float OwnDistance, int Other, float OtherDistance)>();
        foreach (var i in candidates)
        {
            var (own, ownDistance) = NearestAmong(photos, members[i], members);
            var (other, otherDistance) = NearestOtherSku(photos, indexOfId, source, members[i], Math.Min(ownDistance, options.OutlierSearchRadius), buffer);
            if (other >= 0 && otherDistance < ownDistance && !FinishSaysOwn(finishes, members[i], members, other))
            {
                flagged.Add((members[i], own, ownDistance, other, otherDistance));
            }
        }

        if (k == 2 && flagged.Count == 2)
        {
            flagged = [flagged.MinBy(f => f.OtherDistance)];
        }

        reported.UnionWith(flagged.Select(f => f.Member));
        return [.. flagged.Select(f => Build(photos, f.Member, f.Own, f.OwnDistance, f.Other, f.OtherDistance, spread))];
    }

    /// <summary>
    /// True when the finishes are known and speak against a move: the photo's finish is at least
    /// <see cref="FinishMinDifference"/> from the other SKU's photo and less than half as far from some photo of its
    /// own SKU, e.g. a brass gear that is merely nearer to the black one.
    /// </summary>
    private static bool FinishSaysOwn(IReadOnlyList<FinishSignature?>? finishes, int member, int[] members, int other)
    {
        if (finishes?[member] is not { } finish || finishes[other] is not { } otherFinish)
        {
            return false;
        }

        var toOther = finish.DifferenceTo(otherFinish);
        var toOwn = members.Where(m => m != member && finishes[m] is not null).Select(m => finish.DifferenceTo(finishes[m]!)).DefaultIfEmpty(double.MaxValue).Min();
        return toOther >= FinishMinDifference && toOwn < toOther / 2;
    }

    private static List<SweepFinding> FinishOutliers(
        IReadOnlyList<SweepPhoto> photos,
        IReadOnlyDictionary<int, int> indexOfId,
        INeighbourSource source,
        SweepOptions options,
        int[] members,
        List<SweepNeighbour> buffer,
        HashSet<int> reported,
        IReadOnlyList<FinishSignature?> finishes)
    {
        var known = members.Where(m => finishes[m] is not null).ToArray();
        if (members.Length < 3 || known.Length < 3)
        {
            return [];
        }

        var gaps = known.Select(m => known.Where(o => o != m).Min(o => finishes[m]!.DifferenceTo(finishes[o]!))).ToArray();
        var candidates = Enumerable.Range(0, known.Length).Where(i => gaps[i] >= FinishMinDifference).ToList();
        if (candidates.Count == 0 || candidates.Count > known.Length / 2)
        {
            return [];
        }

        var findings = new List<SweepFinding>();
        foreach (var i in candidates.Where(i => !reported.Contains(known[i])))
        {
            var member = known[i];
            var (own, ownDistance) = NearestAmong(photos, member, members);
            var (other, otherDistance) = NearestOtherSku(
                photos, indexOfId, source, member, Math.Min(ownDistance, options.OutlierSearchRadius), buffer,
                j => finishes[j] is { } finish && finish.DifferenceTo(finishes[member]!) <= FinishMatchMaxDifference);
            if (other >= 0 && otherDistance < ownDistance)
            {
                var spread = Median(NearestOwn(photos, members));
                findings.Add(Build(photos, member, own, ownDistance, other, otherDistance, spread, gaps[i]));
            }
        }

        return findings;
    }

    private static SweepFinding Build(
        IReadOnlyList<SweepPhoto> photos, int member, int own, float ownDistance, int other, float otherDistance, float? spread, double? finishDifference = null)
    {
        var photo = photos[member];
        var evidence = new OutlierEvidence(ownDistance, spread, photos[other].Sku, otherDistance, finishDifference);
        var flagged = FindingMember.Of(photo, MemberRole.Flagged);
        return new SweepFinding(
            FindingKind.FarFromItsSku,
            FindingKeys.Outlier(photo.Sha256, photo.Sku),
            [flagged, FindingMember.Of(photos[own], MemberRole.NearestInOwnSku), FindingMember.Of(photos[other], MemberRole.NearestInOtherSku)],
            [],
            Verdicts.ForOutlier(flagged, evidence),
            evidence);
    }

    // Clamped: for identical photos 1 − dot can round to just below 0, which a verdict would print as "-0.000".
    private static float Distance(SweepPhoto a, SweepPhoto b) => Math.Max(0f, 1f - TensorPrimitives.Dot(a.Embedding.Span, b.Embedding.Span));

    private static float[] NearestOwn(IReadOnlyList<SweepPhoto> photos, int[] members)
    {
        var nearest = new float[members.Length];
        Array.Fill(nearest, float.MaxValue);
        for (var i = 0; i < members.Length; i++)
        {
            for (var j = i + 1; j < members.Length; j++)
            {
                var d = Distance(photos[members[i]], photos[members[j]]);
                nearest[i] = Math.Min(nearest[i], d);
                nearest[j] = Math.Min(nearest[j], d);
            }
        }

        return nearest;
    }

    /// <summary>Distance of each photo to the normalised mean of the other photos of its SKU.</summary>
    private static float[] DistanceToRest(IReadOnlyList<SweepPhoto> photos, int[] members)
    {
        var dimension = photos[members[0]].Embedding.Length;
        var sum = new float[dimension];
        foreach (var m in members)
        {
            TensorPrimitives.Add(sum, photos[m].Embedding.Span, sum);
        }

        var rest = new float[dimension];
        var distances = new float[members.Length];
        for (var i = 0; i < members.Length; i++)
        {
            var x = photos[members[i]].Embedding.Span;
            TensorPrimitives.Subtract(sum, x, rest);
            var norm = TensorPrimitives.Norm(rest);
            distances[i] = norm > 1e-6f ? 1f - (TensorPrimitives.Dot(x, rest) / norm) : 0f;
        }

        return distances;
    }

    private static (int Index, float Distance) NearestAmong(IReadOnlyList<SweepPhoto> photos, int member, int[] members)
    {
        var (best, bestDistance) = (-1, float.MaxValue);
        foreach (var other in members)
        {
            if (other != member && Distance(photos[member], photos[other]) is var d && d < bestDistance)
            {
                (best, bestDistance) = (other, d);
            }
        }

        return (best, bestDistance);
    }

    private static (int Index, float Distance) NearestOtherSku(
        IReadOnlyList<SweepPhoto> photos,
        IReadOnlyDictionary<int, int> indexOfId,
        INeighbourSource source,
        int member,
        float radius,
        List<SweepNeighbour> buffer,
        Func<int, bool>? accept = null)
    {
        buffer.Clear();
        source.FindWithin(photos[member].Id, radius, buffer);
        var (best, bestDistance) = (-1, float.MaxValue);
        foreach (var neighbour in buffer)
        {
            if (indexOfId.TryGetValue(neighbour.PhotoId, out var j) &&
                !string.Equals(photos[j].Sku, photos[member].Sku, StringComparison.Ordinal) &&
                (accept is null || accept(j)) &&
                Distance(photos[member], photos[j]) is var d && d < bestDistance)
            {
                (best, bestDistance) = (j, d);
            }
        }

        return (best, bestDistance);
    }

    private static float Median(float[] values)
    {
        var sorted = values.Order().ToArray();
        var mid = sorted.Length / 2;
        return sorted.Length % 2 == 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
    }
}

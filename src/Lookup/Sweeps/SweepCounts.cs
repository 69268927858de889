namespace Lookup.Sweeps;

/// <summary>What the sweep looked at and what it found, in numbers.</summary>
public sealed record SweepCounts
{
    /// <summary>Live photos swept.</summary>
    public int Photos { get; init; }

    /// <summary>Distinct SKUs among them.</summary>
    public int Skus { get; init; }

    /// <summary>Unordered pairs within the search radius, each examined once.</summary>
    public long PairsExamined { get; init; }

    /// <summary>Pairs of byte-identical files.</summary>
    public long IdenticalPairs { get; init; }

    /// <summary>Pairs with the same pixels.</summary>
    public long SamePixelPairs { get; init; }

    /// <summary>Pairs where one photo is an edited copy of the other.</summary>
    public long CopyPairs { get; init; }

    /// <summary>Pairs of different photos that look alike across SKUs.</summary>
    public long LookAlikePairs { get; init; }

    /// <summary>Pairs of different photos inside one SKU within the look-alike distance: normal (e.g. two views of one
    /// part), not reported.</summary>
    public long OtherViewPairs { get; init; }

    /// <summary>Pairs within the copy distance where a thumbnail was missing, judged by the dHash alone.</summary>
    public long PairsWithoutThumbnails { get; init; }

    /// <summary>Findings dropped because a reviewer dismissed them or all their pairs.</summary>
    public int SuppressedByDecisions { get; init; }

    /// <summary>Findings dropped by "new only" because an earlier sweep reported them.</summary>
    public int AlreadyReported { get; init; }
}

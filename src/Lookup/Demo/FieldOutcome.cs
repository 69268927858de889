using Lookup.Matching;

namespace Lookup.Demo;

/// <summary>How the matcher answered one demo field photo, judged against the truth file.</summary>
/// <param name="Photo">The field photo and its true SKU.</param>
/// <param name="Ranking">The nearest SKUs, nearest first; empty when the photo could not be used.</param>
/// <param name="Failure">Why the photo could not be used, or null.</param>
internal sealed record FieldOutcome(DemoFieldPhoto Photo, IReadOnlyList<SkuMatch> Ranking, string? Failure)
{
    /// <summary>How many rows count as "among the first few" for <see cref="InTopThree"/>.</summary>
    public const int TopFew = 3;

    /// <summary>True when the supplier stocks the part (the truth names a SKU).</summary>
    public bool Stocked => Photo.Sku is not null;

    /// <summary>The first row, or null.</summary>
    public SkuMatch? Top => Ranking.Count > 0 ? Ranking[0] : null;

    /// <summary>The answer's verdict (no match when nothing was ranked).</summary>
    public Verdict Verdict => Top?.Verdict ?? Verdict.NoMatch;

    /// <summary>A stocked part: the first SKU is the true one. A part not stocked: the verdict is no match.</summary>
    public bool Right => Stocked ? Top?.Sku == Photo.Sku : Failure is null && Verdict == Verdict.NoMatch;

    /// <summary>For a stocked part, whether the true SKU is among the first <see cref="TopFew"/> rows; null otherwise.</summary>
    public bool? InTopThree => Stocked ? Ranking.Take(TopFew).Any(r => r.Sku == Photo.Sku) : null;
}

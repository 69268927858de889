using Lookup.Store;

namespace Lookup.Matching;

/// <summary>
/// Turns a SKU's distance into a <see cref="Verdict"/>. Distance alone cannot tell a stocked part from an unstocked
/// look-alike, so a same-part answer must also be clearly nearer than the next SKU: the relative margin
/// (d₂ − d₁) / d₂ must reach <see cref="VerdictThresholds.MinMargin"/>, a ratio test in the spirit of Lowe (2004,
/// "Distinctive image features from scale-invariant keypoints", section 7.1: keep a match only when the nearest
/// neighbour is clearly nearer than the second). The margin and distance defaults are measured in DEVELOPERS.md,
/// section Matching.
/// </summary>
public static class VerdictRule
{
    /// <summary>
    /// Most dHash bits (of 64) in which a whole query photo may differ from a catalogue photo and still be called the
    /// same photo. Re-encodes, resizes and small tone changes move a few bits and unrelated photos about 32 (sweep
    /// measurements in DEVELOPERS.md); 10 is from memory, a common "near duplicate" bound. The hash keeps a render or
    /// snapshot of a look-alike part, which can sit within the copy distance, from being called the same photo.
    /// </summary>
    public const int SamePhotoMaxHashBits = 10;

    /// <summary>The relative margin of <paramref name="distance"/> over the nearest other SKU's distance; 1 when there is none.</summary>
    public static float Margin(float distance, float? nearestOther)
    {
        if (nearestOther is not float other)
        {
            return 1f;
        }

        return other <= 0 ? (distance <= 0 ? 0f : -1f) : (other - distance) / other;
    }

    /// <summary>The verdict for one SKU of a ranking.</summary>
    /// <param name="identicalFile">The query's SHA-256 equals one of the SKU's photos'.</param>
    /// <param name="distance">The SKU's score: best cosine distance over the query's crops and the SKU's photos.</param>
    /// <param name="margin">See <see cref="Margin"/>; negative for every SKU but the nearest.</param>
    /// <param name="wholePhotoDistance">Distance from the whole query photo (no crop) to the SKU's nearest photo.</param>
    /// <param name="hashBits">dHash bits in which the whole query photo differs from that photo; null when unknown.</param>
    /// <param name="thresholds">The index's thresholds.</param>
    public static Verdict Decide(bool identicalFile, float distance, float margin, float wholePhotoDistance, int? hashBits, VerdictThresholds thresholds)
    {
        ArgumentNullException.ThrowIfNull(thresholds);
        if (identicalFile)
        {
            return Verdict.SameFile;
        }

        if (distance > thresholds.SamePart)
        {
            return Verdict.NoMatch;
        }

        if (margin < thresholds.MinMargin)
        {
            return Verdict.Unsure;
        }

        bool copy = wholePhotoDistance <= thresholds.Copy && hashBits is int bits && bits <= SamePhotoMaxHashBits;
        return copy ? Verdict.SamePhoto : Verdict.SamePart;
    }
}

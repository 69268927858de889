namespace Lookup.Sweeps;

/// <summary>
/// Where one photo's content might sit inside another's frame: a region of the container photo with the content
/// photo's aspect ratio, centred at (<paramref name="CentreX"/>, <paramref name="CentreY"/>) in fractions of the
/// container's width and height, <paramref name="Scale"/> times the largest such region that fits, turned by
/// <paramref name="AngleDegrees"/> (clockwise on screen), optionally mirrored left to right.
/// </summary>
public readonly record struct AlignmentHypothesis(
    float CentreX,
    float CentreY,
    float Scale,
    float AngleDegrees,
    bool Mirrored)
{
    /// <summary>The whole frame, unturned and unmirrored.</summary>
    public static AlignmentHypothesis FullFrame { get; } = new(0.5f, 0.5f, 1f, 0f, false);
}

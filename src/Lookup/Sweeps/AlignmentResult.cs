namespace Lookup.Sweeps;

/// <summary>
/// The best alignment found between two thumbnails: the normalised cross-correlation of the content photo's
/// thumbnail with the container region under <paramref name="Hypothesis"/> (1 = same picture up to brightness and
/// contrast), and whether photo A of the pair was the container.
/// </summary>
public readonly record struct AlignmentResult(float Correlation, AlignmentHypothesis Hypothesis, bool ContainerIsA)
{
    /// <summary>No alignment was tried or none fitted.</summary>
    public static AlignmentResult None { get; } = new(0f, AlignmentHypothesis.FullFrame, true);
}

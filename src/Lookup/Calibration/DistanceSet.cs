namespace Lookup.Calibration;

/// <summary>One half's measured distances: copies to their originals, siblings and strangers (the last two sorted).</summary>
internal sealed class DistanceSet(CopyDistance[] copies, float[] siblings, float[] strangers)
{
    public CopyDistance[] Copies { get; } = copies;

    /// <summary>Copy distances sorted ascending.</summary>
    public float[] CopyDistances { get; } = copies.Select(c => c.Distance).Order().ToArray();

    public float[] Siblings { get; } = siblings;

    public float[] Strangers { get; } = strangers;
}

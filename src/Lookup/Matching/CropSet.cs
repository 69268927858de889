namespace Lookup.Matching;

/// <summary>
/// Which parts of a query photo are embedded. Field photos show the part small and off-centre on a busy bench, so one
/// centre square mostly describes the bench; each extra crop is one more network run (about 45 ms on one core).
/// </summary>
public enum CropSet
{
    /// <summary>The whole photo only (its centred square, as catalogue photos are embedded).</summary>
    None,

    /// <summary>The whole photo plus five squares of 0.7 × the short side: centre and the four corners (6 runs).</summary>
    Standard,

    /// <summary>Standard plus a 3 × 3 grid of squares of 0.45 × the short side (15 runs).</summary>
    Dense,
}

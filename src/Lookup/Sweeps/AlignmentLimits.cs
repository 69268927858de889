namespace Lookup.Sweeps;

/// <summary>The search space of <see cref="ThumbnailAligner"/>; see <see cref="SweepOptions"/> for each value's source.</summary>
internal readonly record struct AlignmentLimits(
    float MinCropScale,
    float UpscaleSlack,
    bool CropsMayBeUpscaled,
    float MaxAngleDegrees,
    float CoarseFloor)
{
    public static AlignmentLimits From(SweepOptions options) => new(
        options.MinCropScale,
        options.UpscaleSlack,
        options.CropsMayBeUpscaled,
        options.MaxRotationDegrees,
        options.AlignmentCoarseFloor);
}

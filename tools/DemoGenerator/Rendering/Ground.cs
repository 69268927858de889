using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// The plane y = 0 the parts rest on, and what is seen beyond it. Far from the subject the ground fades into the
/// backdrop between <see cref="FadeStart"/> and <see cref="FadeEnd"/> (distances from the world origin in mm).
/// </summary>
internal abstract class Ground
{
    public required double FadeStart { get; init; }

    public required double FadeEnd { get; init; }

    public abstract GroundSample Sample(double x, double z);

    public abstract Vec3 Backdrop(Vec3 direction);
}

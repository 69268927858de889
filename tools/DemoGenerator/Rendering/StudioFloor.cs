using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>A plain light sweep, as in a product photo booth: one even colour, no texture.</summary>
internal sealed class StudioFloor : Ground
{
    private static readonly Vec3 Paper = new(0.80, 0.795, 0.78);

    public required Vec3 BackdropColour { get; init; }

    public override GroundSample Sample(double x, double z) => new(Paper, 0.04, 3);

    public override Vec3 Backdrop(Vec3 direction) => BackdropColour * (1 - (0.12 * DetMath.Clamp01(direction.Y)));
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// Round wire wound around the y axis: coil radius <c>coilRadius</c>, wire radius <c>wireRadius</c>, rise
/// <c>pitch</c> per turn, cut flat at ±<c>halfHeight</c> like ground spring ends. The point is unwound along
/// the helix and measured against the nearest turn; the result is only near-exact, so wrap it in
/// <see cref="Shrunk"/>.
/// </summary>
internal sealed class CoilHelix(double coilRadius, double wireRadius, double pitch, double halfHeight) : Shape
{
    public override double Distance(Vec3 p)
    {
        double radial = p.LengthXZ - coilRadius;
        double tube = Math.Max(Math.Abs(radial) - wireRadius, Math.Abs(p.Y) - halfHeight - wireRadius);
        if (tube > 0.5)
        {
            return tube;
        }

        double angle = DetMath.Atan2(p.Z, p.X);
        double along = p.Y - (pitch * angle / DetMath.TwoPi);
        along -= pitch * Math.Round(along / pitch);
        double wire = Math.Sqrt((radial * radial) + (along * along)) - wireRadius;
        return Math.Max(wire, Math.Abs(p.Y) - halfHeight);
    }
}

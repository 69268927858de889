using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// A spring (split lock) washer: a ring of rectangular section around the y axis, mean radius
/// <c>meanRadius</c>, section half sizes <c>halfWidth</c> × <c>halfThickness</c>, whose two cut ends are lifted
/// apart by <c>lift</c> at the split on the −x side. Near-exact: wrap it in <see cref="Shrunk"/>.
/// </summary>
internal sealed class SplitRing(double meanRadius, double halfWidth, double halfThickness, double lift, double gap) : Shape
{
    public override double Distance(Vec3 p)
    {
        double band = Math.Max(Math.Abs(p.LengthXZ - meanRadius) - halfWidth, Math.Abs(p.Y) - halfThickness - (lift / 2));
        if (band > 0.5)
        {
            return band;
        }

        double angle = DetMath.Atan2(p.Z, p.X);
        double y = p.Y - (lift * angle / DetMath.TwoPi);
        double qx = Math.Abs(p.LengthXZ - meanRadius) - halfWidth;
        double qy = Math.Abs(y) - halfThickness;
        double ring = Math.Min(Math.Max(qx, qy), 0) + Math.Sqrt((Math.Max(qx, 0) * Math.Max(qx, 0)) + (Math.Max(qy, 0) * Math.Max(qy, 0)));
        double slot = Math.Max(Math.Abs(p.Z) - gap, p.X);
        return Math.Max(ring, -slot);
    }
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>A cylinder along y, centred on the origin, with its rims rounded by <c>round</c>.</summary>
internal sealed class Cylinder(double radius, double halfHeight, double round = 0) : Shape
{
    public override double Distance(Vec3 p)
    {
        double dx = p.LengthXZ - radius + round;
        double dy = Math.Abs(p.Y) - halfHeight + round;
        double outside = Math.Sqrt((Math.Max(dx, 0) * Math.Max(dx, 0)) + (Math.Max(dy, 0) * Math.Max(dy, 0)));
        return Math.Min(Math.Max(dx, dy), 0) + outside - round;
    }
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>A ring in the xz plane: centre-line radius <c>major</c>, tube radius <c>minor</c>.</summary>
internal sealed class Torus(double major, double minor) : Shape
{
    public override double Distance(Vec3 p)
    {
        double qx = p.LengthXZ - major;
        return Math.Sqrt((qx * qx) + (p.Y * p.Y)) - minor;
    }
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// The double cone ρ + slope·|y| ≤ radius around the y axis. Intersected with a prism or cylinder it makes the
/// chamfers on nuts, bolt heads and rod tips.
/// </summary>
internal sealed class Bicone(double radius, double slope) : Shape
{
    private readonly double _norm = 1 / Math.Sqrt(1 + (slope * slope));

    public override double Distance(Vec3 p) => (p.LengthXZ + (slope * Math.Abs(p.Y)) - radius) * _norm;
}

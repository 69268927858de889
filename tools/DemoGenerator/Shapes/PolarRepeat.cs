using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// <c>count</c> copies of a shape spaced evenly around the y axis. The shape is modelled once on the +x axis;
/// each point is turned into that sector before it is measured.
/// </summary>
internal sealed class PolarRepeat(Shape inner, int count, double phase = 0) : Shape
{
    private readonly double _sector = DetMath.TwoPi / count;

    public override double Distance(Vec3 p)
    {
        double angle = DetMath.Atan2(p.Z, p.X) - phase;
        double local = angle - (_sector * Math.Round(angle / _sector));
        var (s, c) = DetMath.SinCos(local);
        double r = p.LengthXZ;
        return inner.Distance(new Vec3(r * c, p.Y, r * s));
    }
}

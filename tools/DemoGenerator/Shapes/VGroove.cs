using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// The ring-shaped space of a V-belt groove around the y axis: from radius <c>bottomRadius</c> outwards, with
/// half width <c>bottomHalfWidth</c> at the bottom that widens by <c>flank</c> per millimetre of radius.
/// Used as a cutter.
/// </summary>
internal sealed class VGroove(double bottomRadius, double bottomHalfWidth, double flank) : Shape
{
    private readonly double _norm = 1 / Math.Sqrt(1 + (flank * flank));

    public override double Distance(Vec3 p)
    {
        double r = p.LengthXZ;
        double side = (Math.Abs(p.Y) - bottomHalfWidth - ((r - bottomRadius) * flank)) * _norm;
        return Math.Max(bottomRadius - r, side);
    }
}

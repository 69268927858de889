using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// A rod along y from −<c>halfLength</c> to +<c>halfLength</c> with a helical V thread of the given pitch cut
/// <c>depth</c> deep below the major <c>radius</c>. Near-exact: wrap it in <see cref="Shrunk"/>.
/// </summary>
internal sealed class ThreadedRod(double radius, double pitch, double depth, double halfLength) : Shape
{
    public override double Distance(Vec3 p)
    {
        double outside = Math.Max(p.LengthXZ - radius, Math.Abs(p.Y) - halfLength);
        if (outside > 0.5)
        {
            return outside;
        }

        double angle = DetMath.Atan2(p.Z, p.X);
        double phase = DetMath.Fract((p.Y / pitch) + (angle / DetMath.TwoPi));
        double v = Math.Abs(phase - 0.5) * 2;
        double profile = radius - (depth * v);
        return Math.Max(p.LengthXZ - profile, Math.Abs(p.Y) - halfLength);
    }
}

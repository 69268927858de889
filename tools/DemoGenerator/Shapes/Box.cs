using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>A box centred on the origin with half sizes <c>half</c> and edges rounded by <c>round</c>.</summary>
internal sealed class Box(double halfX, double halfY, double halfZ, double round = 0) : Shape
{
    public override double Distance(Vec3 p)
    {
        double qx = Math.Abs(p.X) - halfX + round;
        double qy = Math.Abs(p.Y) - halfY + round;
        double qz = Math.Abs(p.Z) - halfZ + round;
        double outside = new Vec3(Math.Max(qx, 0), Math.Max(qy, 0), Math.Max(qz, 0)).Length;
        double inside = Math.Min(Math.Max(qx, Math.Max(qy, qz)), 0);
        return outside + inside - round;
    }
}

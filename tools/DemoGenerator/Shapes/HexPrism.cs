using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>A hexagonal prism along y: <c>apothem</c> is half the width across flats; a flat faces +z.</summary>
internal sealed class HexPrism(double apothem, double halfHeight) : Shape
{
    private const double Kx = -0.8660254037844386;
    private const double Kz = 0.5;
    private const double HalfSideOverApothem = 0.5773502691896258;

    public override double Distance(Vec3 p)
    {
        // Fold the plane into one sixth by mirroring, then measure to the single edge that is left.
        double x = Math.Abs(p.X);
        double z = Math.Abs(p.Z);
        double fold = 2 * Math.Min((Kx * x) + (Kz * z), 0);
        x -= fold * Kx;
        z -= fold * Kz;
        double limit = HalfSideOverApothem * apothem;
        double cx = x < -limit ? -limit : x > limit ? limit : x;
        double ex = x - cx;
        double ez = z - apothem;
        double d2 = Math.Sqrt((ex * ex) + (ez * ez)) * (ez < 0 ? -1 : 1);
        double dy = Math.Abs(p.Y) - halfHeight;
        double outside = Math.Sqrt((Math.Max(d2, 0) * Math.Max(d2, 0)) + (Math.Max(dy, 0) * Math.Max(dy, 0)));
        return Math.Min(Math.Max(d2, dy), 0) + outside;
    }
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>The body with every cutter removed.</summary>
internal sealed class Difference(Shape body, Shape[] cutters) : Shape
{
    private const double SkipCuttersBeyond = 0.5;

    public override double Distance(Vec3 p)
    {
        double d = body.Distance(p);
        if (d > SkipCuttersBeyond)
        {
            // Cutters only remove material, so the body's distance is already a lower bound out here.
            return d;
        }

        foreach (var cutter in cutters)
        {
            d = Math.Max(d, -cutter.Distance(p));
        }

        return d;
    }
}

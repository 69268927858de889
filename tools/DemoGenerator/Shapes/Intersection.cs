using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>Only what both shapes share.</summary>
internal sealed class Intersection(Shape a, Shape b) : Shape
{
    // No early exit when far outside one operand: that operand's distance can badly underestimate (think of the
    // unused three quarters of a torus cut to an elbow), and soft shadows turn every underestimate into a dark ring.
    public override double Distance(Vec3 p) => Math.Max(a.Distance(p), b.Distance(p));
}

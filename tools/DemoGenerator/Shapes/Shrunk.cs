using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// Scales the inner distance by <c>factor</c> &lt; 1. Domain warps (threads, helices, polar folds) stretch space,
/// so their raw distance can overshoot; shrinking it keeps sphere tracing from stepping through the surface.
/// </summary>
internal sealed class Shrunk(Shape inner, double factor) : Shape
{
    public override double Distance(Vec3 p) => inner.Distance(p) * factor;
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>A shape moved by <c>offset</c> without turning (cheaper than a full <see cref="Transformed"/>).</summary>
internal sealed class Translated(Shape inner, Vec3 offset) : Shape
{
    public override double Distance(Vec3 p) => inner.Distance(p - offset);
}

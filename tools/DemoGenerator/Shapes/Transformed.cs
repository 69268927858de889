using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>A shape rotated by <c>rotation</c> and then moved by <c>offset</c> (rigid, so distances are kept).</summary>
internal sealed class Transformed(Shape inner, Mat3 rotation, Vec3 offset) : Shape
{
    private readonly Mat3 _inverse = rotation.Transposed;

    public override double Distance(Vec3 p) => inner.Distance(_inverse * (p - offset));
}

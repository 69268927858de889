using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>The side of the plane dot(p, normal) = offset away from which the normal points.</summary>
internal sealed class HalfSpace : Shape
{
    private readonly Vec3 _normal;
    private readonly double _offset;

    public HalfSpace(Vec3 normal, double offset)
    {
        double length = normal.Length;
        _normal = normal * (1 / length);
        _offset = offset / length;
    }

    public override double Distance(Vec3 p) => Vec3.Dot(p, _normal) - _offset;
}

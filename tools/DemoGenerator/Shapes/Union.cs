using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>All of the parts together.</summary>
internal sealed class Union(params Shape[] parts) : Shape
{
    public override double Distance(Vec3 p)
    {
        double d = double.MaxValue;
        foreach (var part in parts)
        {
            d = Math.Min(d, part.Distance(p));
        }

        return d;
    }
}

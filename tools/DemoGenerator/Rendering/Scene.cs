using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// Everything one photo shows: solids on the ground, the ground itself and the light. <c>DetailScale</c> (mm)
/// sets how far ambient occlusion looks, so a 12 mm washer and an 80 mm pulley get the same soft contact shadow.
/// Immutable after construction; many threads may query it at once.
/// </summary>
internal sealed class Scene
{
    private readonly SceneObject[] _objects;

    public Scene(IReadOnlyList<SceneObject> objects, Ground ground, Lighting lighting, double detailScale)
    {
        _objects = [.. objects];
        Ground = ground;
        Lighting = lighting;
        DetailScale = detailScale;
        var min = new Vec3(double.MaxValue, double.MaxValue, double.MaxValue);
        var max = new Vec3(double.MinValue, double.MinValue, double.MinValue);
        foreach (var o in _objects)
        {
            min = new Vec3(Math.Min(min.X, o.Centre.X - o.Radius), Math.Min(min.Y, o.Centre.Y - o.Radius), Math.Min(min.Z, o.Centre.Z - o.Radius));
            max = new Vec3(Math.Max(max.X, o.Centre.X + o.Radius), Math.Max(max.Y, o.Centre.Y + o.Radius), Math.Max(max.Z, o.Centre.Z + o.Radius));
        }

        BoundsCentre = (min + max) * 0.5;
        BoundsRadius = (max - min).Length * 0.5;
    }

    public IReadOnlyList<SceneObject> Objects => _objects;

    public Ground Ground { get; }

    public Lighting Lighting { get; }

    public double DetailScale { get; }

    public Vec3 BoundsCentre { get; }

    public double BoundsRadius { get; }

    /// <summary>
    /// Distance to the nearest solid (a lower bound) and which one it is. Objects whose bounding sphere is more
    /// than <paramref name="exactWithin"/> away answer with the distance to that sphere: cheaper, still a lower
    /// bound, but too small for soft shadows and occlusion, which therefore ask for exact answers further out.
    /// </summary>
    public double Distance(Vec3 p, double exactWithin, out int nearest)
    {
        double best = double.MaxValue;
        nearest = -1;
        for (int i = 0; i < _objects.Length; i++)
        {
            var o = _objects[i];
            double bound = (p - o.Centre).Length - o.Radius;
            if (bound >= best)
            {
                continue;
            }

            double d = bound > exactWithin ? bound : o.Shape.Distance(p);
            if (d < best)
            {
                best = d;
                nearest = i;
            }
        }

        return best;
    }

    public double Distance(Vec3 p, double exactWithin) => Distance(p, exactWithin, out _);

    /// <summary>As <see cref="Distance(Vec3, double, out int)"/>, over the listed solids only (used along shadow rays).</summary>
    public double Distance(Vec3 p, ReadOnlySpan<int> only, double exactWithin)
    {
        double best = double.MaxValue;
        foreach (int i in only)
        {
            var o = _objects[i];
            double bound = (p - o.Centre).Length - o.Radius;
            if (bound < best)
            {
                best = Math.Min(best, bound > exactWithin ? bound : o.Shape.Distance(p));
            }
        }

        return best;
    }
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Shapes;

/// <summary>
/// A solid described by a signed distance function: negative inside, positive outside, and never larger than
/// the true distance to the surface (a lower bound is enough for sphere tracing; exact is not required).
/// Coordinates are millimetres. Instances are immutable and safe to share between threads.
/// </summary>
internal abstract class Shape
{
    public abstract double Distance(Vec3 p);

    public Shape Move(double x, double y, double z) => new Translated(this, new Vec3(x, y, z));

    public Shape Turn(Mat3 rotation) => new Transformed(this, rotation, Vec3.Zero);

    public Shape Minus(params Shape[] cutters) => new Difference(this, cutters);

    public Shape And(Shape other) => new Intersection(this, other);
}

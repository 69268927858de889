namespace Lookup.DemoGenerator.Geometry;

/// <summary>A 3×3 rotation matrix stored by rows.</summary>
internal readonly struct Mat3(Vec3 row0, Vec3 row1, Vec3 row2)
{
    public readonly Vec3 Row0 = row0;
    public readonly Vec3 Row1 = row1;
    public readonly Vec3 Row2 = row2;

    public static Mat3 Identity => new(new Vec3(1, 0, 0), new Vec3(0, 1, 0), new Vec3(0, 0, 1));

    public Mat3 Transposed => new(
        new Vec3(Row0.X, Row1.X, Row2.X),
        new Vec3(Row0.Y, Row1.Y, Row2.Y),
        new Vec3(Row0.Z, Row1.Z, Row2.Z));

    public static Mat3 RotationX(double radians)
    {
        var (s, c) = DetMath.SinCos(radians);
        return new Mat3(new Vec3(1, 0, 0), new Vec3(0, c, -s), new Vec3(0, s, c));
    }

    public static Mat3 RotationY(double radians)
    {
        var (s, c) = DetMath.SinCos(radians);
        return new Mat3(new Vec3(c, 0, s), new Vec3(0, 1, 0), new Vec3(-s, 0, c));
    }

    public static Mat3 RotationZ(double radians)
    {
        var (s, c) = DetMath.SinCos(radians);
        return new Mat3(new Vec3(c, -s, 0), new Vec3(s, c, 0), new Vec3(0, 0, 1));
    }

    public static Vec3 operator *(Mat3 m, Vec3 v) => new(Vec3.Dot(m.Row0, v), Vec3.Dot(m.Row1, v), Vec3.Dot(m.Row2, v));

    public static Mat3 operator *(Mat3 a, Mat3 b)
    {
        var bt = b.Transposed;
        return new Mat3(
            new Vec3(Vec3.Dot(a.Row0, bt.Row0), Vec3.Dot(a.Row0, bt.Row1), Vec3.Dot(a.Row0, bt.Row2)),
            new Vec3(Vec3.Dot(a.Row1, bt.Row0), Vec3.Dot(a.Row1, bt.Row1), Vec3.Dot(a.Row1, bt.Row2)),
            new Vec3(Vec3.Dot(a.Row2, bt.Row0), Vec3.Dot(a.Row2, bt.Row1), Vec3.Dot(a.Row2, bt.Row2)));
    }
}

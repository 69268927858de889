namespace Lookup.DemoGenerator.Geometry;

/// <summary>A point or direction in double precision; plain scalar arithmetic so results are bit-identical on every machine.</summary>
internal readonly struct Vec3(double x, double y, double z)
{
    public readonly double X = x;
    public readonly double Y = y;
    public readonly double Z = z;

    public static Vec3 Zero => new(0, 0, 0);

    public double Length => Math.Sqrt((X * X) + (Y * Y) + (Z * Z));

    public double LengthXZ => Math.Sqrt((X * X) + (Z * Z));

    public Vec3 Normalized => this * (1.0 / Length);

    public Vec3 Abs => new(Math.Abs(X), Math.Abs(Y), Math.Abs(Z));

    public double MaxComponent => Math.Max(X, Math.Max(Y, Z));

    public static Vec3 operator +(Vec3 a, Vec3 b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);

    public static Vec3 operator -(Vec3 a, Vec3 b) => new(a.X - b.X, a.Y - b.Y, a.Z - b.Z);

    public static Vec3 operator -(Vec3 a) => new(-a.X, -a.Y, -a.Z);

    public static Vec3 operator *(Vec3 a, double s) => new(a.X * s, a.Y * s, a.Z * s);

    public static Vec3 operator *(Vec3 a, Vec3 b) => new(a.X * b.X, a.Y * b.Y, a.Z * b.Z);

    public static double Dot(Vec3 a, Vec3 b) => (a.X * b.X) + (a.Y * b.Y) + (a.Z * b.Z);

    public static Vec3 Cross(Vec3 a, Vec3 b) =>
        new((a.Y * b.Z) - (a.Z * b.Y), (a.Z * b.X) - (a.X * b.Z), (a.X * b.Y) - (a.Y * b.X));

    public static Vec3 Max(Vec3 a, double m) => new(Math.Max(a.X, m), Math.Max(a.Y, m), Math.Max(a.Z, m));

    public static Vec3 Lerp(Vec3 a, Vec3 b, double t) => a + ((b - a) * t);

    /// <summary>Mirror <paramref name="d"/> about the plane with normal <paramref name="n"/>.</summary>
    public static Vec3 Reflect(Vec3 d, Vec3 n) => d - (n * (2 * Dot(d, n)));

    public override string ToString() => $"({X:0.###}, {Y:0.###}, {Z:0.###})";
}

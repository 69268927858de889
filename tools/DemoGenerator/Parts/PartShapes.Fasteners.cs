using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Parts;

internal static partial class PartShapes
{
    /// <summary>Hex head bolt M<paramref name="d"/> × <paramref name="length"/>; head up, thread down.</summary>
    private static PartModel HexBolt(double d, double length)
    {
        double af = AcrossFlats(d);
        double k = d switch { <= 6 => 4, <= 8 => 5.3, _ => 6.4 };
        double threaded = Math.Min(length, (2 * d) + 6);
        var parts = new List<Shape>
        {
            ChamferedHex(af, k).Move(0, (length / 2) + (k / 2), 0),
            new Cylinder((0.9 * af / 2) - 0.2, 0.25, 0.1).Move(0, (length / 2) + 0.2, 0),
            ThreadedLength(d, threaded).Move(0, (-length / 2) + (threaded / 2), 0),
        };
        if (length > threaded)
        {
            double plain = length - threaded;
            parts.Add(new Cylinder(d / 2, (plain / 2) + 0.3).Move(0, (length / 2) - (plain / 2), 0));
        }

        var shape = new Union([.. parts]).Move(0, -k / 2, 0);
        return new PartModel(shape, new Vec3(af * 0.6, (length / 2) + k + 1, af * 0.6), LyingPoses(af, d, length + k));
    }

    /// <summary>Lying on a hex flat with the tip down on the bench, standing on the head, lying turned.</summary>
    private static Mat3[] LyingPoses(double headWidth, double d, double length)
    {
        double tilt = DetMath.Atan2((headWidth / 2) - (d / 2), length);
        var lying = Mat3.RotationZ(tilt - DetMath.HalfPi) * Mat3.RotationY(DetMath.Pi / 6);
        return Poses(lying, Mat3.RotationX(DetMath.Pi), lying * Mat3.RotationY(DetMath.Pi / 3));
    }

    /// <summary>Hex nut with a tapped, countersunk bore.</summary>
    private static PartModel HexNut(double d)
    {
        double af = AcrossFlats(d);
        double m = d switch { <= 6 => 5.2, <= 8 => 6.8, _ => 8.4 };
        double pitch = ThreadPitch(d);
        var shape = ChamferedHex(af, m).Minus(
            new Shrunk(new ThreadedRod((d / 2) - 0.1, pitch, 0.5 * pitch, m), 0.6),
            new Bicone((d / 2) + 0.8, 1).Move(0, m / 2, 0),
            new Bicone((d / 2) + 0.8, 1).Move(0, -m / 2, 0));
        return new PartModel(shape, new Vec3(af * 0.6, (m / 2) + 0.5, af * 0.6), Poses(Mat3.Identity, Mat3.RotationY(0.4), Mat3.RotationX(DetMath.HalfPi)));
    }

    /// <summary>Plain washer, ISO 7089 sizes.</summary>
    private static PartModel FlatWasher(double d)
    {
        var (inner, outer, t) = d switch { <= 6 => (6.4, 12.0, 1.6), <= 8 => (8.4, 16.0, 1.6), _ => (10.5, 20.0, 2.0) };
        var shape = new Cylinder(outer / 2, t / 2, 0.3).Minus(new Cylinder(inner / 2, t, 0.0));
        return new PartModel(shape, new Vec3((outer / 2) + 0.5, t, (outer / 2) + 0.5), Poses(Mat3.Identity, Mat3.RotationY(1.1)));
    }

    /// <summary>Split spring washer, DIN 127 B sizes.</summary>
    private static PartModel SpringWasher(double d)
    {
        var (inner, outer, s) = d switch { <= 6 => (6.1, 11.8, 1.6), <= 8 => (8.1, 14.8, 2.0), _ => (10.2, 18.1, 2.2) };
        var ring = new SplitRing((inner + outer) / 4, (outer - inner) / 4, s / 2, s * 1.1, 0.45);
        var shape = new Shrunk(ring, 0.7);
        return new PartModel(shape, new Vec3((outer / 2) + 0.5, s * 1.3, (outer / 2) + 0.5), Poses(Mat3.Identity, Mat3.RotationY(2.0)));
    }

    /// <summary>Lifting eye bolt (collar pattern), ring up, short thread down.</summary>
    private static PartModel EyeBolt(double d)
    {
        double minor = d * 0.45;
        double major = (d * 1.25) + minor;
        double threadLength = d * 1.65;
        double ringCentre = major + (minor * 0.4);
        var ring = new Torus(major, minor).Turn(Mat3.RotationX(DetMath.HalfPi)).Move(0, ringCentre, 0);
        var collar = new Cylinder(d * 1.05, d * 0.22, 0.5).Move(0, -d * 0.22, 0);
        var neck = new Cylinder(d * 0.62, minor * 0.7, 0.6).Move(0, minor * 0.5, 0);
        var thread = ThreadedLength(d, threadLength).Move(0, (-d * 0.44) - (threadLength / 2) + 0.3, 0);
        double top = ringCentre + major + minor;
        double bottom = (-d * 0.44) - threadLength;
        var shape = new Union(ring, collar, neck, thread).Move(0, -(top + bottom) / 2, 0);
        var lying = Mat3.RotationX(DetMath.HalfPi);
        return new PartModel(shape, new Vec3(major + minor + 1, ((top - bottom) / 2) + 1, Math.Max(minor, d * 1.05) + 1), Poses(lying, Mat3.Identity, lying * Mat3.RotationY(DetMath.Pi)));
    }

    /// <summary>Wing nut (not sold by the demo supplier).</summary>
    private static PartModel WingNut(double d)
    {
        double pitch = ThreadPitch(d);
        var body = new Cylinder(d * 0.95, d * 0.6, 0.9);
        var wing = new Box(d * 0.75, d * 0.85, 1.2, 1.1);
        var right = wing.Turn(Mat3.RotationZ(-0.2)).Move(d * 1.55, d * 0.55, 0);
        var left = wing.Turn(Mat3.RotationZ(0.2)).Move(-d * 1.55, d * 0.55, 0);
        var shape = new Union(body, right, left).Minus(new Shrunk(new ThreadedRod((d / 2) - 0.1, pitch, 0.5 * pitch, d * 2), 0.6)).Move(0, -d * 0.4, 0);
        return new PartModel(shape, new Vec3(d * 2.6, d * 1.5, d), Poses(Mat3.Identity, Mat3.RotationY(0.7)));
    }

    /// <summary>Socket head cap screw (not sold by the demo supplier): round knurled head, hex socket.</summary>
    private static PartModel SocketCapScrew(double d, double length)
    {
        double headRadius = d * 0.75;
        double threaded = Math.Min(length, (2 * d) + 12);
        var head = new Cylinder(headRadius, d / 2, 0.7).Move(0, (length / 2) + (d / 2), 0);
        var knurl = new PolarRepeat(new Cylinder(0.32, d * 0.3).Move(headRadius, 0, 0), 36).Move(0, (length / 2) + (d * 0.4), 0);
        var socket = new HexPrism(d * 0.375, d * 0.35).Move(0, (length / 2) + d, 0);
        var parts = new List<Shape> { head.Minus(knurl, socket), ThreadedLength(d, threaded).Move(0, (-length / 2) + (threaded / 2), 0) };
        if (length > threaded)
        {
            double plain = length - threaded;
            parts.Add(new Cylinder(d / 2, (plain / 2) + 0.3).Move(0, (length / 2) - (plain / 2), 0));
        }

        var shape = new Union([.. parts]).Move(0, -d / 2, 0);
        return new PartModel(shape, new Vec3(headRadius + 1, (length / 2) + d + 1, headRadius + 1), LyingPoses(2 * headRadius, d, length + d));
    }
}

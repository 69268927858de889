using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Parts;

/// <summary>
/// Builds the solid of each part family from its sizes. Dimensions follow common practice for metric
/// fasteners and fittings (from memory, rounded); they only need to look right, not to be a standard.
/// The part's axis is y unless a builder says otherwise.
/// </summary>
internal static partial class PartShapes
{
    /// <summary>Turns the y axis onto +x.</summary>
    private static readonly Mat3 YToX = Mat3.RotationZ(-DetMath.HalfPi);

    /// <summary>Turns the y axis onto +z.</summary>
    private static readonly Mat3 YToZ = Mat3.RotationX(DetMath.HalfPi);

    public static PartModel Build(PartSpec spec) => spec.Kind switch
    {
        PartKind.HexBolt => HexBolt(spec.Size, spec.Length),
        PartKind.HexNut => HexNut(spec.Size),
        PartKind.FlatWasher => FlatWasher(spec.Size),
        PartKind.SpringWasher => SpringWasher(spec.Size),
        PartKind.AngleBracket => AngleBracket(spec.Size),
        PartKind.ButtHinge => ButtHinge(spec.Size),
        PartKind.PipeElbow => PipeElbow(spec.Size),
        PartKind.PipeTee => PipeFitting(spec.Size, [new Vec3(1, 0, 0), new Vec3(-1, 0, 0), new Vec3(0, 0, 1)]),
        PartKind.PipeCross => PipeFitting(spec.Size, [new Vec3(1, 0, 0), new Vec3(-1, 0, 0), new Vec3(0, 0, 1), new Vec3(0, 0, -1)]),
        PartKind.SpurGear => SpurGear(spec.Size, spec.Count, spec.Length),
        PartKind.CoilSpring => CoilSpring(spec.Size, spec.Length, spec.Count),
        PartKind.VBeltPulley => VBeltPulley(spec.Size, spec.Count),
        PartKind.EyeBolt => EyeBolt(spec.Size),
        PartKind.WingNut => WingNut(spec.Size),
        PartKind.SocketCapScrew => SocketCapScrew(spec.Size, spec.Length),
        _ => throw new ArgumentOutOfRangeException(nameof(spec), spec.Kind, "No shape builder for this part kind."),
    };

    private static double ThreadPitch(double d) => d switch
    {
        <= 6 => 1.0,
        <= 8 => 1.25,
        _ => 1.5,
    };

    private static double AcrossFlats(double d) => d switch
    {
        <= 6 => 10,
        <= 8 => 13,
        _ => 16,
    };

    /// <summary>A threaded length centred on the origin, its lower end chamfered like a cut screw tip.</summary>
    private static Shape ThreadedLength(double d, double length)
    {
        double pitch = ThreadPitch(d);
        double chamfer = 0.7 * pitch;
        const double Reach = 20;
        var rod = new ThreadedRod(d / 2, pitch, 0.55 * pitch, length / 2);
        var tip = new Bicone((d / 2) + Reach, 1).Move(0, (-length / 2) + Reach + chamfer, 0);
        return new Shrunk(rod.And(tip), 0.6);
    }

    /// <summary>Flat top and bottom edges of a hex are cut by a 30° cone, as on real nuts and heads.</summary>
    private static Shape ChamferedHex(double acrossFlats, double height) =>
        new HexPrism(acrossFlats / 2, height / 2).And(new Bicone((0.95 * acrossFlats / 2) + (1.732 * height / 2), 1.732));

    private static Mat3[] Poses(params Mat3[] poses) => poses;
}

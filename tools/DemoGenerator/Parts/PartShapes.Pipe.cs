using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Parts;

internal static partial class PartShapes
{
    /// <summary>90° solder elbow for copper pipe of outside diameter <paramref name="d"/>, lying flat.</summary>
    private static PartModel PipeElbow(double d)
    {
        double bend = d * 1.15;
        double body = (d / 2) + 1.0;
        double socket = (d / 2) + 1.5;
        double socketLength = d * 0.8;
        var quadrant = new HalfSpace(new Vec3(-1, 0, 0), 0).And(new HalfSpace(new Vec3(0, 0, -1), 0));
        var bendTube = new Torus(bend, body).And(quadrant);
        var socketA = new Cylinder(socket, socketLength / 2, 0.6).Turn(YToZ).Move(bend, 0, (-socketLength / 2) + 0.5);
        var socketB = new Cylinder(socket, socketLength / 2, 0.6).Turn(YToX).Move((-socketLength / 2) + 0.5, 0, bend);
        var passage = new Torus(bend, (d / 2) - 0.8);
        var boreA = new Cylinder(d / 2, (socketLength / 2) + 0.5).Turn(YToZ).Move(bend, 0, (-socketLength / 2) - 0.5);
        var boreB = new Cylinder(d / 2, (socketLength / 2) + 0.5).Turn(YToX).Move((-socketLength / 2) - 0.5, 0, bend);
        double centre = (bend + socket - socketLength) / 2;
        var shape = new Union(bendTube, socketA, socketB).Minus(passage, boreA, boreB).Move(-centre, 0, -centre);
        double half = ((bend + socket + socketLength) / 2) + 1;
        return new PartModel(shape, new Vec3(half, socket + 1, half), Poses(Mat3.Identity, Mat3.RotationZ(-DetMath.HalfPi), Mat3.RotationY(DetMath.Pi)));
    }

    /// <summary>Equal tee or cross for copper pipe: one socketed arm per direction (unit x or z vectors).</summary>
    private static PartModel PipeFitting(double d, Vec3[] arms)
    {
        double body = (d / 2) + 1.0;
        double socket = (d / 2) + 1.5;
        double socketLength = d * 0.8;
        double arm = d * 0.75;
        var solids = new List<Shape>();
        var cutters = new List<Shape>();
        foreach (var dir in arms)
        {
            var turn = dir.X != 0 ? YToX : YToZ;
            solids.Add(new Cylinder(body, arm / 2).Turn(turn).Move(dir.X * arm / 2, 0, dir.Z * arm / 2));
            double socketCentre = arm + (socketLength / 2) - 0.5;
            solids.Add(new Cylinder(socket, socketLength / 2, 0.6).Turn(turn).Move(dir.X * socketCentre, 0, dir.Z * socketCentre));
            cutters.Add(new Cylinder((d / 2) - 0.8, (arm / 2) + 0.5).Turn(turn).Move(dir.X * arm / 2, 0, dir.Z * arm / 2));
            cutters.Add(new Cylinder(d / 2, (socketLength / 2) + 1).Turn(turn).Move(dir.X * (socketCentre + 1), 0, dir.Z * (socketCentre + 1)));
        }

        double reach = arm + socketLength - 0.5;
        bool hasBack = Array.Exists(arms, a => a.Z < 0);
        double shiftZ = hasBack ? 0 : -(reach - socket) / 2;
        var shape = new Union([.. solids]).Minus([.. cutters]).Move(0, 0, shiftZ);
        var branchUp = Mat3.RotationX(-DetMath.HalfPi);
        return new PartModel(shape, new Vec3(reach + 1, socket + 1, reach + 1), Poses(Mat3.Identity, branchUp, Mat3.RotationY(DetMath.Pi)));
    }
}

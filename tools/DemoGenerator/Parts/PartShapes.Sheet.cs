using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Parts;

internal static partial class PartShapes
{
    /// <summary>Pressed angle bracket with legs of <paramref name="leg"/> mm, a stiffening rib, a hole and a slot.</summary>
    private static PartModel AngleBracket(double leg)
    {
        double width = leg <= 40 ? 20 : 25;
        double t = leg <= 40 ? 2.5 : 3.0;
        var flat = new Box(leg / 2, t / 2, width / 2, 0.4).Move(leg / 2, t / 2, 0);
        var upright = new Box(t / 2, leg / 2, width / 2, 0.4).Move(t / 2, leg / 2, 0);
        var rib = new Box(leg * 0.14, 1.4, 1.8, 1.2).Turn(Mat3.RotationZ(-DetMath.Pi / 4)).Move(t + (leg * 0.05), t + (leg * 0.05), 0);
        var hole = new Cylinder(2.7, t * 2).Move(leg * 0.64, 0, 0);
        var slot = new Box(t * 2, 5, 2.7, 2.65).Move(0, leg * 0.62, 0);
        var shape = new Union(flat, upright, rib).Minus(hole, slot).Move(-leg / 2, -leg / 2, 0);
        var tent = Mat3.RotationZ(5 * DetMath.Pi / 4);
        var onSide = Mat3.RotationX(DetMath.HalfPi);
        return new PartModel(shape, new Vec3((leg / 2) + 1, (leg / 2) + 1, (width / 2) + 1), Poses(Mat3.Identity, tent, onSide));
    }

    /// <summary>Butt hinge <paramref name="length"/> mm long, opened flat, five knuckles, countersunk holes.</summary>
    private static PartModel ButtHinge(double length)
    {
        double leaf = length <= 75 ? 22 : 28;
        double t = length <= 75 ? 2.0 : 2.5;
        double knuckle = length <= 75 ? 6.5 : 8.0;
        double r = knuckle / 2;
        double leafCentre = (r * 0.7) + (leaf / 2);
        double leafY = -r + (t / 2);
        var parts = new List<Shape>
        {
            new Cylinder(r, length / 2, 0.4).Turn(YToZ),
            new Cylinder(r * 0.55, (length / 2) + 0.9, 0.5).Turn(YToZ),
            new Box(leaf / 2, t / 2, length / 2, 0.5).Move(leafCentre, leafY, 0),
            new Box(leaf / 2, t / 2, length / 2, 0.5).Move(-leafCentre, leafY, 0),
        };
        var cutters = new List<Shape>();
        foreach (double z in new[] { -0.3, -0.1, 0.1, 0.3 })
        {
            cutters.Add(new Box(r + 0.2, r + 0.2, 0.25).Move(0, 0, z * length));
        }

        double holeX = (r * 0.7) + (leaf * 0.55);
        foreach (double side in new[] { -1.0, 1.0 })
        {
            foreach (double z in new[] { -0.36, 0.0, 0.36 })
            {
                cutters.Add(new Cylinder(2.1, t * 3).Move(side * holeX, 0, z * length));
                cutters.Add(new Bicone(4.3, 1).Move(side * holeX, -r + t, z * length));
            }
        }

        var shape = new Union([.. parts]).Minus([.. cutters]);
        return new PartModel(shape, new Vec3(leaf + r + 1, r + 1, (length / 2) + 2), Poses(Mat3.Identity, Mat3.RotationY(0.5), Mat3.RotationY(DetMath.HalfPi)));
    }
}

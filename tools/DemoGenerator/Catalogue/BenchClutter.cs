using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Rendering;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// Scatters everyday workbench things around the photographed part: dowels and pencils, wood offcuts,
/// tape rolls, paper scraps and screwdrivers. None of them is a catalogue part.
/// </summary>
internal static class BenchClutter
{
    private static readonly Vec3[] Plastics =
    [
        new(0.55, 0.06, 0.04), new(0.05, 0.16, 0.45), new(0.70, 0.52, 0.05), new(0.08, 0.30, 0.10), new(0.25, 0.25, 0.26), new(0.60, 0.25, 0.05),
    ];

    private static readonly Material Steel = new(new Vec3(0.62, 0.62, 0.62), 1.0, 0.25, 7);

    /// <summary>Adds up to <paramref name="count"/> items between <paramref name="inner"/> and <paramref name="outer"/> mm from the origin.</summary>
    public static void Scatter(List<SceneObject> objects, SeededRandom rng, int count, double inner, double outer, double scale)
    {
        var taken = new List<(double X, double Z, double R)> { (0, 0, inner) };
        for (int placed = 0, attempt = 0; placed < count && attempt < count * 30; attempt++)
        {
            double angle = rng.Range(0, DetMath.TwoPi);
            double reach = rng.Range(inner, outer);
            var (s, c) = DetMath.SinCos(angle);
            double x = reach * c;
            double z = reach * s;
            double size = scale * rng.Range(0.35, 1.0);
            if (taken.Exists(t => Math.Sqrt(((t.X - x) * (t.X - x)) + ((t.Z - z) * (t.Z - z))) < t.R + (size * 0.8)))
            {
                continue;
            }

            taken.Add((x, z, size));
            objects.AddRange(Item(rng, x, z, size));
            placed++;
        }
    }

    private static IEnumerable<SceneObject> Item(SeededRandom rng, double x, double z, double size)
    {
        var turn = Mat3.RotationY(rng.Range(0, DetMath.TwoPi));
        var lieX = Mat3.RotationZ(-DetMath.HalfPi);
        var plastic = new Material(rng.Pick(Plastics), 0, 0.6, 4);
        switch (rng.Next(5))
        {
            case 0:
            {
                double r = size * rng.Range(0.05, 0.09);
                var dowel = new Cylinder(r, size, r * 0.4).Turn(turn * lieX).Move(x, r, z);
                var wood = new Material(new Vec3(0.55, 0.38, 0.2) * rng.Range(0.7, 1.1), 0, 0.8, 3);
                yield return new SceneObject(dowel, rng.Next(2) == 0 ? wood : plastic, new Vec3(x, r, z), size + r);
                break;
            }

            case 1:
            {
                double hx = size * rng.Range(0.4, 0.8);
                double hy = size * rng.Range(0.08, 0.2);
                double hz = size * rng.Range(0.2, 0.4);
                var block = new Box(hx, hy, hz, 0.8).Turn(turn).Move(x, hy, z);
                var wood = new Material(new Vec3(0.62, 0.45, 0.26) * rng.Range(0.75, 1.05), 0, 0.85, 3);
                yield return new SceneObject(block, wood, new Vec3(x, hy, z), new Vec3(hx, hy, hz).Length);
                break;
            }

            case 2:
            {
                double r = size * rng.Range(0.3, 0.5);
                double h = size * rng.Range(0.12, 0.25);
                var roll = new Cylinder(r, h, 0.5).Minus(new Cylinder(r * 0.62, h * 2)).Move(x, h, z);
                yield return new SceneObject(roll, plastic, new Vec3(x, h, z), Math.Sqrt((r * r) + (h * h)));
                break;
            }

            case 3:
            {
                double hx = size * rng.Range(0.6, 1.0);
                double hz = size * rng.Range(0.4, 0.8);
                var sheet = new Box(hx, 0.25, hz, 0.2).Turn(turn).Move(x, 0.25, z);
                var paper = new Material(new Vec3(0.78, 0.76, 0.68) * rng.Range(0.8, 1.0), 0, 0.9, 2);
                yield return new SceneObject(sheet, paper, new Vec3(x, 0.25, z), Math.Sqrt((hx * hx) + (hz * hz)));
                break;
            }

            default:
            {
                double r = size * 0.1;
                double handle = size * 0.45;
                double shaft = size * 0.55;
                var lie = turn * lieX;
                var grip = new Cylinder(r, handle, r * 0.6).Turn(lie).Move(x, r, z);
                var rodCentre = new Vec3(x, r, z) + (turn * new Vec3(handle + shaft, 0, 0));
                var rod = new Cylinder(r * 0.28, shaft, 0.2).Turn(lie).Move(rodCentre.X, rodCentre.Y, rodCentre.Z);
                yield return new SceneObject(grip, plastic, new Vec3(x, r, z), handle + r);
                yield return new SceneObject(rod, Steel, rodCentre, shaft + r);
                break;
            }
        }
    }
}

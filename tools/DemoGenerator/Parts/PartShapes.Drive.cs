using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Parts;

internal static partial class PartShapes
{
    /// <summary>Spur gear of module <paramref name="module"/> with <paramref name="teeth"/> teeth and a hub on one face.</summary>
    private static PartModel SpurGear(double module, int teeth, double faceWidth)
    {
        double pitchRadius = module * teeth / 2;
        double root = pitchRadius - (1.25 * module);
        double tip = pitchRadius + module;
        double halfB = faceWidth / 2;
        // Tooth flanks: straight lines that narrow the tooth from root to tip (an involute only needs to look like one).
        double halfAtPitch = DetMath.Pi * module / 4;
        const double Taper = 0.36;
        var flankA = new HalfSpace(new Vec3(Taper, 0, 1), halfAtPitch + (Taper * pitchRadius));
        var flankB = new HalfSpace(new Vec3(Taper, 0, -1), halfAtPitch + (Taper * pitchRadius));
        var tooth = new Box((tip - root) / 2 + 0.4, halfB, module * 2.5, 0.0).Move((tip + root) / 2, 0, 0).And(flankA).And(flankB);
        var rim = new Cylinder(tip, halfB, 0.35).And(new Union(new Cylinder(root + 0.1, halfB), new PolarRepeat(tooth, teeth)));
        double hubRadius = Math.Min(root * 0.5, 11);
        double hubLength = faceWidth * 0.8;
        var hub = new Cylinder(hubRadius, (hubLength / 2) + 0.5, 0.5).Move(0, halfB + (hubLength / 2) - 0.5, 0);
        double bore = hubRadius * 0.5;
        var cutters = new List<Shape>
        {
            new Cylinder(bore, faceWidth * 3),
            new Box(bore * 0.3, faceWidth * 3, bore * 0.22).Move(bore, 0, 0),
        };
        if (teeth >= 30)
        {
            double recessOuter = root - (2.5 * module);
            cutters.Add(new Cylinder(recessOuter, 1.0, 0.5).Minus(new Cylinder(hubRadius + 1.5, 3)).Move(0, -halfB, 0));
            double holeRing = (recessOuter + hubRadius) / 2;
            double holeRadius = (recessOuter - hubRadius) * 0.3;
            cutters.Add(new PolarRepeat(new Cylinder(holeRadius, faceWidth).Move(holeRing, 0, 0), 6, 0.3));
        }

        var shape = new Shrunk(new Union(rim, hub).Minus([.. cutters]), 0.85).Move(0, -hubLength / 2, 0);
        return new PartModel(shape, new Vec3(tip + 1, halfB + hubLength + 1, tip + 1), Poses(Mat3.Identity, Mat3.RotationX(DetMath.Pi), Mat3.RotationY(0.9)));
    }

    /// <summary>Compression spring: outside diameter, free length and number of turns.</summary>
    private static PartModel CoilSpring(double outside, double freeLength, int turns)
    {
        double wire = outside * 0.1;
        double coil = (outside - wire) / 2;
        double pitch = (freeLength - wire) / turns;
        var shape = new Shrunk(new CoilHelix(coil, wire / 2, pitch, freeLength / 2), 0.55);
        var lying = Mat3.RotationZ(DetMath.HalfPi);
        return new PartModel(shape, new Vec3((outside / 2) + 1, (freeLength / 2) + 1, (outside / 2) + 1), Poses(lying, Mat3.Identity, lying * Mat3.RotationY(1.3)));
    }

    /// <summary>V-belt pulley for A-section belts: outside diameter and number of grooves.</summary>
    private static PartModel VBeltPulley(double outside, int grooves)
    {
        const double GroovePitch = 15;
        const double GrooveDepth = 11;
        const double Flank = 0.344; // tan 19°, half the usual 38° groove angle (common practice).
        double width = (GroovePitch * grooves) + 5;
        double halfW = width / 2;
        double hubRadius = (outside * 0.16) + 4;
        double recessRadius = (outside / 2) - 13.5;
        double web = 6;
        var cutters = new List<Shape>();
        for (int g = 0; g < grooves; g++)
        {
            double y = (g - ((grooves - 1) / 2.0)) * GroovePitch;
            cutters.Add(new VGroove((outside / 2) - GrooveDepth, 2.7, Flank).Move(0, y, 0));
        }

        double recessHalf = ((halfW + 1) - (web / 2)) / 2;
        double recessCentre = (web / 2) + recessHalf;
        foreach (double side in new[] { -1.0, 1.0 })
        {
            cutters.Add(new Cylinder(recessRadius, recessHalf, 0.8).Minus(new Cylinder(hubRadius, width)).Move(0, side * recessCentre, 0));
        }

        double bore = hubRadius * 0.42;
        cutters.Add(new Cylinder(bore, width * 2));
        cutters.Add(new Box(bore * 0.3, width * 2, bore * 0.25).Move(bore, 0, 0));
        if (outside >= 80)
        {
            cutters.Add(new PolarRepeat(new Cylinder(5.5, width).Move((hubRadius + recessRadius) / 2, 0, 0), 4, 0.4));
        }

        var body = new Union(new Cylinder(outside / 2, halfW, 0.6), new Cylinder(hubRadius, halfW + 2, 0.6));
        var shape = body.Minus([.. cutters]);
        return new PartModel(shape, new Vec3((outside / 2) + 1, halfW + 3, (outside / 2) + 1), Poses(Mat3.Identity, Mat3.RotationX(DetMath.HalfPi), Mat3.RotationY(0.8)));
    }
}

using System.Collections.Concurrent;
using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Parts;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// Sets a part down on the bench: rotates it into a rest pose, finds its lowest point by sampling the solid on a
/// grid, and lifts it so that point touches y = 0. Grid results depend only on the part and pose (a turn about
/// the vertical changes neither), so they are computed once and cached.
/// </summary>
internal static class PartPlacement
{
    private const int GridCells = 32;
    private static readonly ConcurrentDictionary<(string Code, int Pose), RestMeasure> Cache = new();

    public static PlacedPart Place(PartSpec spec, int poseIndex, double yaw, double x, double z)
    {
        var model = PartShapes.Build(spec);
        int pose = poseIndex % model.RestPoses.Count;
        var rest = Cache.GetOrAdd((spec.Code, pose), _ => Measure(model, model.RestPoses[pose]));
        var turn = Mat3.RotationY(yaw);
        var offset = new Vec3(x, -rest.LowestY, z);
        var shape = new Transformed(model.Shape, turn * model.RestPoses[pose], offset);
        return new PlacedPart(shape, (turn * rest.Centre) + offset, rest.Radius);
    }

    /// <summary>
    /// Every grid point inside the solid (distance d &lt; 0) proves the ball of radius |d| around it is solid, so
    /// y + d over such points bounds the lowest point from above and is exact where a flat face is nearest.
    /// Min and max are order-free, so the parallel slices give the same answer on every run.
    /// </summary>
    private static RestMeasure Measure(PartModel model, Mat3 pose)
    {
        var h = model.HalfExtents;
        var step = new Vec3(2 * h.X / GridCells, 2 * h.Y / GridCells, 2 * h.Z / GridCells);
        var slices = new (double Lowest, Vec3 Min, Vec3 Max, List<Vec3> Inside)[GridCells + 1];
        Parallel.For(0, GridCells + 1, i =>
        {
            double lowest = double.MaxValue;
            var min = new Vec3(double.MaxValue, double.MaxValue, double.MaxValue);
            var max = new Vec3(double.MinValue, double.MinValue, double.MinValue);
            var inside = new List<Vec3>();
            for (int j = 0; j <= GridCells; j++)
            {
                for (int k = 0; k <= GridCells; k++)
                {
                    var p = new Vec3(-h.X + (i * step.X), -h.Y + (j * step.Y), -h.Z + (k * step.Z));
                    double d = model.Shape.Distance(p);
                    if (d >= 0)
                    {
                        continue;
                    }

                    var q = pose * p;
                    inside.Add(q);
                    lowest = Math.Min(lowest, q.Y + d);
                    min = new Vec3(Math.Min(min.X, q.X), Math.Min(min.Y, q.Y), Math.Min(min.Z, q.Z));
                    max = new Vec3(Math.Max(max.X, q.X), Math.Max(max.Y, q.Y), Math.Max(max.Z, q.Z));
                }
            }

            slices[i] = (lowest, min, max, inside);
        });

        double low = double.MaxValue;
        var lo = new Vec3(double.MaxValue, double.MaxValue, double.MaxValue);
        var hi = new Vec3(double.MinValue, double.MinValue, double.MinValue);
        foreach (var s in slices.Where(s => s.Inside.Count > 0))
        {
            low = Math.Min(low, s.Lowest);
            lo = new Vec3(Math.Min(lo.X, s.Min.X), Math.Min(lo.Y, s.Min.Y), Math.Min(lo.Z, s.Min.Z));
            hi = new Vec3(Math.Max(hi.X, s.Max.X), Math.Max(hi.Y, s.Max.Y), Math.Max(hi.Z, s.Max.Z));
        }

        if (low == double.MaxValue)
        {
            throw new InvalidOperationException("The part's solid was not found inside its stated bounds; enlarge HalfExtents in PartShapes.");
        }

        var centre = (lo + hi) * 0.5;
        double margin = step.Length;
        double farthest = slices.SelectMany(s => s.Inside).Max(q => (q - centre).Length);
        double radius = farthest + margin;
        return new RestMeasure(low, centre, radius);
    }
}

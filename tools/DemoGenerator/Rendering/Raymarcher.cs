using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// Sphere tracing (Hart, 1996) of a <see cref="Scene"/>: one ray per pixel, then four more per pixel on edges
/// (where neighbours hit different things, or a part's shading jumps).
/// Rows run in parallel, but every pixel is computed from the scene alone with no shared sums, so the result
/// is the same bytes however the rows are scheduled.
/// </summary>
internal static partial class Raymarcher
{
    private const int MaxSteps = 180;

    /// <summary>Rotated-grid offsets inside a pixel for the edge pass.</summary>
    private static readonly (double X, double Y)[] SubSamples = [(0.375, 0.125), (0.875, 0.375), (0.625, 0.875), (0.125, 0.625)];

    /// <summary>Render; <paramref name="smoothEdges"/> adds the four-sample pass (field photos skip it: they are blurred anyway).</summary>
    public static RgbBuffer Render(Scene scene, Camera camera, int width, int height, bool smoothEdges)
    {
        var first = new RgbBuffer(width, height);
        var hits = new int[width * height];
        Parallel.For(0, height, y =>
        {
            for (int x = 0; x < width; x++)
            {
                first[x, y] = Trace(scene, camera.Position, camera.Ray(x + 0.5, y + 0.5, width, height), out hits[(y * width) + x]);
            }
        });

        var result = new RgbBuffer(width, height);
        Parallel.For(0, height, y =>
        {
            for (int x = 0; x < width; x++)
            {
                if (!smoothEdges || !IsEdge(first, hits, x, y))
                {
                    result[x, y] = first[x, y];
                    continue;
                }

                var sum = Vec3.Zero;
                foreach (var (sx, sy) in SubSamples)
                {
                    sum += Trace(scene, camera.Position, camera.Ray(x + sx, y + sy, width, height), out _);
                }

                result[x, y] = sum * 0.25;
            }
        });
        return result;
    }

    private static bool IsEdge(RgbBuffer image, int[] hits, int x, int y)
    {
        int w = image.Width;
        int id = hits[(y * w) + x];
        double centre = Brightness(image[x, y]);
        for (int dy = -1; dy <= 1; dy++)
        {
            for (int dx = -1; dx <= 1; dx++)
            {
                int nx = Math.Clamp(x + dx, 0, image.Width - 1);
                int ny = Math.Clamp(y + dy, 0, image.Height - 1);
                int other = hits[(ny * w) + nx];
                if (other != id || (id >= 0 && Math.Abs(Brightness(image[nx, ny]) - centre) > 0.07))
                {
                    return true;
                }
            }
        }

        return false;
    }

    /// <summary>Perceptual-ish brightness (square root of luma) so dark edges count as much as bright ones.</summary>
    private static double Brightness(Vec3 c) => Math.Sqrt(Math.Max(0, (0.3 * c.X) + (0.59 * c.Y) + (0.11 * c.Z)));

    /// <summary>Colour seen along a ray; <paramref name="hit"/> is the index of the solid hit, −1 for ground or backdrop.</summary>
    private static Vec3 Trace(Scene scene, Vec3 origin, Vec3 dir, out int hit)
    {
        hit = -1;
        double tGround = dir.Y < -1e-9 ? -origin.Y / dir.Y : double.MaxValue;
        if (SphereSpan(origin, dir, scene.BoundsCentre, scene.BoundsRadius, out double enter, out double exit))
        {
            double t = Math.Max(enter, 0);
            double end = Math.Min(exit, tGround);
            for (int i = 0; i < MaxSteps && t <= end; i++)
            {
                var p = origin + (dir * t);
                double d = scene.Distance(p, 1.0, out int nearest);
                if (d < (0.0004 * t) + 0.006)
                {
                    hit = nearest;
                    return ShadeSolid(scene, scene.Objects[nearest], p, dir);
                }

                t += d;
            }
        }

        if (tGround == double.MaxValue)
        {
            return scene.Ground.Backdrop(dir);
        }

        var onGround = origin + (dir * tGround);
        var colour = ShadeGround(scene, onGround, dir);
        double fade = DetMath.SmoothStep(scene.Ground.FadeStart, scene.Ground.FadeEnd, onGround.LengthXZ);
        return Vec3.Lerp(colour, scene.Ground.Backdrop(dir), fade);
    }

    /// <summary>Where a ray is inside a sphere, if anywhere.</summary>
    private static bool SphereSpan(Vec3 origin, Vec3 dir, Vec3 centre, double radius, out double enter, out double exit)
    {
        var oc = origin - centre;
        double b = Vec3.Dot(oc, dir);
        double c = Vec3.Dot(oc, oc) - (radius * radius);
        double disc = (b * b) - c;
        if (disc < 0)
        {
            enter = exit = 0;
            return false;
        }

        double root = Math.Sqrt(disc);
        enter = -b - root;
        exit = -b + root;
        return exit > 0;
    }
}

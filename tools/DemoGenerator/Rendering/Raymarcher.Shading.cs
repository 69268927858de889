using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

internal static partial class Raymarcher
{
    private static readonly Vec3 Up = new(0, 1, 0);
    private static readonly double[] OcclusionSteps = [0.03, 0.08, 0.16, 0.28, 0.45];

    /// <summary>
    /// Lambert diffuse plus Blinn-Phong highlight from the key light, Schlick's Fresnel on the reflected dome,
    /// soft shadow and ambient occlusion. Metals take their colour from the reflection, not from diffuse.
    /// </summary>
    private static Vec3 ShadeSolid(Scene scene, SceneObject solid, Vec3 p, Vec3 dir)
    {
        var light = scene.Lighting;
        var m = solid.Material;
        var n = Normal(solid, p);
        var view = -dir;
        double ndl = Math.Max(0, Vec3.Dot(n, light.KeyDirection));
        double shadow = ndl > 0 ? SoftShadow(scene, p + (n * 0.03), light.KeyDirection) : 0;
        double ao = Occlusion(scene, p, n, includeGround: true);

        double ndv = DetMath.Clamp01(Vec3.Dot(n, view));
        var f0 = Vec3.Lerp(new Vec3(0.04, 0.04, 0.04), m.Albedo, m.Metallic);
        double grazing = DetMath.PowTwoToThe(1 - ndv, 2) * (1 - ndv);
        var fresnel = f0 + ((new Vec3(1, 1, 1) - f0) * (grazing * (1 - (0.6 * m.Roughness))));

        var reflected = Vec3.Reflect(dir, n);
        var environment = light.Dome.Radiance(reflected, m.Roughness);
        var half = (light.KeyDirection + view).Normalized;
        double lobe = DetMath.PowTwoToThe(Math.Max(0, Vec3.Dot(n, half)), m.SpecularExponentLog2);
        double highlight = lobe * (0.5 + (m.SpecularExponentLog2 * 0.25)) * shadow * ndl;

        var diffuse = m.Albedo * (1 - m.Metallic) * 1.0;
        var lit = (light.KeyColour * (ndl * shadow)) + (light.AmbientColour * ao);
        double reflectionOcclusion = 0.35 + (0.65 * ao);
        return (diffuse * lit) + (fresnel * ((environment * reflectionOcclusion) + (light.KeyColour * highlight)));
    }

    private static Vec3 ShadeGround(Scene scene, Vec3 p, Vec3 dir)
    {
        var light = scene.Lighting;
        var g = scene.Ground.Sample(p.X, p.Z);
        double ndl = Math.Max(0, light.KeyDirection.Y);
        double shadow = SoftShadow(scene, p + (Up * 0.01), light.KeyDirection);
        double ao = Occlusion(scene, p, Up, includeGround: false);
        var half = (light.KeyDirection - dir).Normalized;
        double lobe = DetMath.PowTwoToThe(Math.Max(0, half.Y), g.SpecularExponentLog2) * g.Specular * shadow;
        var diffuse = g.Albedo * ((light.KeyColour * (ndl * shadow)) + (light.AmbientColour * ao));
        var sheen = light.Dome.Radiance(Vec3.Reflect(dir, Up), 0.8) * (g.Specular * 0.25 * ao);
        return diffuse + (light.KeyColour * lobe) + sheen;
    }

    /// <summary>Gradient of the hit solid's distance by the tetrahedron of four samples.</summary>
    private static Vec3 Normal(SceneObject solid, Vec3 p)
    {
        const double E = 0.012;
        var shape = solid.Shape;
        double a = shape.Distance(p + new Vec3(E, -E, -E));
        double b = shape.Distance(p + new Vec3(-E, -E, E));
        double c = shape.Distance(p + new Vec3(-E, E, -E));
        double d = shape.Distance(p + new Vec3(E, E, E));
        var n = new Vec3(a - b - c + d, -a - b + c + d, -a + b - c + d);
        double length = n.Length;
        return length > 0 ? n * (1 / length) : Up;
    }

    /// <summary>
    /// Penumbra estimate along the ray to the light: the closest the ray passes to any solid, relative to how
    /// far along it is (Quilez's soft shadows), smoothed.
    /// </summary>
    private static double SoftShadow(Scene scene, Vec3 p, Vec3 toLight)
    {
        double k = scene.Lighting.ShadowSharpness;
        // Only solids whose sphere, widened by the penumbra reach t / k, meets the ray can darken this point.
        Span<int> blockers = stackalloc int[scene.Objects.Count];
        int count = 0;
        double enter = double.MaxValue;
        double exit = 0;
        for (int i = 0; i < scene.Objects.Count; i++)
        {
            var o = scene.Objects[i];
            double reach = o.Radius + (((o.Centre - p).Length + o.Radius) / k);
            if (SphereSpan(p, toLight, o.Centre, reach, out double e0, out double e1))
            {
                blockers[count++] = i;
                enter = Math.Min(enter, e0);
                exit = Math.Max(exit, e1);
            }
        }

        if (count == 0)
        {
            return 1;
        }

        double res = 1;
        double t = Math.Max(enter, 0.02);
        double minStep = scene.DetailScale * 0.006;
        double maxStep = scene.DetailScale * 0.3;
        for (int i = 0; i < 56 && t < exit; i++)
        {
            // A bounding-sphere distance would darken the penumbra; beyond t / k it cannot lower res below 1.
            double h = scene.Distance(p + (toLight * t), blockers[..count], t / k);
            if (h < 0.0005)
            {
                return 0;
            }

            res = Math.Min(res, k * h / t);
            if (res < 0.01)
            {
                return 0;
            }

            t += Math.Clamp(h, minStep, maxStep);
        }

        res = DetMath.Clamp01(res);
        return res * res * (3 - (2 * res));
    }

    /// <summary>Ambient occlusion from five distance samples along the normal; the ground counts as a solid for parts.</summary>
    private static double Occlusion(Scene scene, Vec3 p, Vec3 n, bool includeGround)
    {
        double occluded = 0;
        double total = 0;
        double weight = 1;
        foreach (double step in OcclusionSteps)
        {
            double h = step * scene.DetailScale;
            var q = p + (n * h);
            double d = scene.Distance(q, h);
            if (includeGround)
            {
                d = Math.Min(d, Math.Max(q.Y, 0));
            }

            occluded += weight * DetMath.Clamp01((h - d) / h);
            total += weight;
            weight *= 0.75;
        }

        return DetMath.Clamp01(1 - (1.3 * occluded / total));
    }
}

using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// A used workbench seen in a field photo: either planked wood with grain, seams and dirt, or a brushed steel
/// sheet with oil stains. All texture is value noise, so a seed fixes it exactly.
/// </summary>
internal sealed class WorkbenchTop : Ground
{
    private readonly ValueNoise _noise;
    private readonly double _cos;
    private readonly double _sin;

    public WorkbenchTop(bool steel, uint seed, double grainAngle)
    {
        Steel = steel;
        _noise = new ValueNoise(seed);
        (_sin, _cos) = DetMath.SinCos(grainAngle);
    }

    public bool Steel { get; }

    public required Vec3 WallColour { get; init; }

    public override GroundSample Sample(double x, double z)
    {
        double u = (x * _cos) + (z * _sin);
        double v = (-x * _sin) + (z * _cos);
        return Steel ? SteelAt(u, v) : WoodAt(u, v);
    }

    public override Vec3 Backdrop(Vec3 direction) => WallColour * (0.8 + (0.2 * DetMath.Clamp01(direction.Y)));

    private GroundSample WoodAt(double u, double v)
    {
        const double PlankWidth = 95;
        double plank = Math.Floor(v / PlankWidth);
        double across = v - (plank * PlankWidth);
        double plankTone = StableHash.Mix((uint)(int)plank, 7, 11) * (1.0 / uint.MaxValue);
        double warp = _noise.Fbm(u * 0.003, (v * 0.012) + (plank * 13.7), 4);
        double rings = DetMath.Fract((across * 0.16) + (warp * 3.5) + (plankTone * 5));
        double band = DetMath.SmoothStep(0.0, 0.25, rings) * (1 - DetMath.SmoothStep(0.55, 1.0, rings));
        double fibre = _noise.Fbm(u * 0.015, v * 0.9, 3);
        var light = new Vec3(0.50, 0.33, 0.18);
        var dark = new Vec3(0.28, 0.16, 0.08);
        var albedo = Vec3.Lerp(light, dark, (0.55 * band) + (0.35 * fibre) + (0.25 * plankTone) - 0.1);
        double seam = DetMath.SmoothStep(0.0, 1.2, Math.Min(across, PlankWidth - across));
        double dirt = DetMath.SmoothStep(0.45, 0.8, _noise.Fbm((u * 0.006) + 40, (v * 0.006) - 12, 4));
        albedo = albedo * (0.35 + (0.65 * seam)) * (1 - (0.35 * dirt));
        return new GroundSample(albedo, 0.06, 4);
    }

    private GroundSample SteelAt(double u, double v)
    {
        double brushed = _noise.Fbm(u * 0.01, v * 1.8, 4);
        double stain = DetMath.SmoothStep(0.5, 0.85, _noise.Fbm((u * 0.008) + 5, (v * 0.008) + 31, 5));
        double grime = _noise.Fbm(u * 0.03, v * 0.03, 3);
        double grey = 0.30 + (0.12 * brushed) - (0.08 * grime);
        var albedo = new Vec3(grey, grey * 1.01, grey * 1.03) * (1 - (0.45 * stain));
        // A grid of 16 mm holes every 100 mm, as on a welding table.
        double hu = u - (100 * Math.Round(u / 100));
        double hv = v - (100 * Math.Round(v / 100));
        double hole = DetMath.SmoothStep(7.5, 8.5, Math.Sqrt((hu * hu) + (hv * hv)));
        albedo *= 0.06 + (0.94 * hole);
        return new GroundSample(albedo, 0.35 * hole * (1 - stain), 5);
    }
}

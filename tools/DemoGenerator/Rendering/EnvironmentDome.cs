using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// The surroundings that metal parts reflect: a sky-to-ground gradient, one large soft box, a rim strip and a
/// dark flag (the black card photographers use so metal edges read). Rough finishes see it blurred: lobes widen
/// and bands soften as <c>roughness</c> grows.
/// </summary>
internal sealed record EnvironmentDome(
    Vec3 Top,
    Vec3 Horizon,
    Vec3 GroundColour,
    Vec3 SoftboxDirection,
    Vec3 SoftboxColour,
    Vec3 RimDirection,
    Vec3 RimColour,
    Vec3 FlagDirection)
{
    public Vec3 Radiance(Vec3 dir, double roughness)
    {
        double width = 0.03 + (roughness * 0.35);
        var sky = Vec3.Lerp(Horizon, Top, DetMath.SmoothStep(0.0, 0.7, dir.Y));
        var colour = Vec3.Lerp(GroundColour, sky, DetMath.SmoothStep(-width, width, dir.Y));
        double flag = DetMath.SmoothStep(0.35 - width, 0.65 + width, Vec3.Dot(dir, FlagDirection));
        colour *= 1 - (0.8 * flag);
        int sharp = Math.Clamp((int)Math.Round(7.0 - (7.0 * roughness)), 2, 7);
        double box = DetMath.PowTwoToThe(Math.Max(0, Vec3.Dot(dir, SoftboxDirection)), sharp);
        double rim = DetMath.PowTwoToThe(Math.Max(0, Vec3.Dot(dir, RimDirection)), sharp);
        double energy = 1 - (0.55 * roughness);
        return colour + (SoftboxColour * (box * energy)) + (RimColour * (rim * energy));
    }
}

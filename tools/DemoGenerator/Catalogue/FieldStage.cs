using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Parts;
using Lookup.DemoGenerator.Rendering;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// A customer's snapshot: the part smaller in frame and off centre, on a wooden or steel bench among clutter,
/// under warm indoor light, slightly soft and grainy.
/// </summary>
internal static class FieldStage
{
    private const double FieldOfView = 0.75;

    public static (Scene Scene, Camera Camera, FilmLook Look) Build(ShotSpec shot)
    {
        var rng = SeededRandom.For(shot.Seed, shot.Key + "/field");
        var part = PartPlacement.Place(shot.Part, shot.Pose, shot.Yaw, 0, 0);
        double frameHalf = part.Radius / shot.Fill;
        var objects = new List<SceneObject> { new(part.Shape, FinishInfo.Look(shot.Part.Finish), part.Centre, part.Radius) };
        BenchClutter.Scatter(objects, rng, 6 + rng.Next(6), part.Radius * 1.25, frameHalf * 2.6, frameHalf * 0.7);

        bool steel = rng.NextDouble() < 0.35;
        var ground = new WorkbenchTop(steel, (uint)rng.NextUInt64(), rng.Range(0, DetMath.Pi))
        {
            WallColour = steel ? new Vec3(0.16, 0.15, 0.14) : new Vec3(0.22, 0.18, 0.14),
            FadeStart = frameHalf * 5,
            FadeEnd = frameHalf * 14,
        };

        double azimuth = rng.Range(-1.3, 1.3);
        double height = rng.Range(0.65, 1.1);
        var (sa, ca) = DetMath.SinCos(azimuth);
        var (sh, ch) = DetMath.SinCos(height);
        var key = new Vec3(sa * ch, sh, ca * ch);
        var benchTone = steel ? new Vec3(0.3, 0.3, 0.31) : new Vec3(0.3, 0.2, 0.11);
        var dome = new EnvironmentDome(
            Top: new Vec3(0.85, 0.75, 0.6),
            Horizon: new Vec3(0.22, 0.18, 0.14),
            GroundColour: benchTone,
            SoftboxDirection: key,
            SoftboxColour: new Vec3(2.0, 1.75, 1.35),
            RimDirection: new Vec3(-sa, 0.5, -ca).Normalized,
            RimColour: new Vec3(0.5, 0.55, 0.65),
            FlagDirection: new Vec3(ca, 0.2, -sa).Normalized);
        double warmth = rng.Range(0.0, 1.0);
        var keyColour = new Vec3(0.95, 0.78 + (0.06 * warmth), 0.55 + (0.1 * warmth)) * 0.85;
        var lighting = new Lighting(key, keyColour, 12, new Vec3(0.22, 0.21, 0.2), dome);
        var scene = new Scene(objects, ground, lighting, part.Radius);

        double offsetRoom = (1 - shot.Fill) * frameHalf * 0.6;
        var target = part.Centre + new Vec3(rng.Range(-offsetRoom, offsetRoom), 0, rng.Range(-offsetRoom, offsetRoom));
        double cameraYaw = rng.Range(-0.9, 0.9);
        double distance = Camera.DistanceToFrame(frameHalf, 1.0, FieldOfView);
        var camera = new Camera(target, cameraYaw, shot.Elevation, distance, FieldOfView);
        var look = new FilmLook(
            BlurPasses: 1 + rng.Next(2),
            Exposure: rng.Range(1.0, 1.25),
            WhiteBalance: new Vec3(1.04, 1.0, 0.9),
            Vignette: rng.Range(0.25, 0.45),
            NoiseLevels: rng.Range(3, 7),
            NoiseSeed: (uint)rng.NextUInt64());
        return (scene, camera, look);
    }
}

using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Parts;
using Lookup.DemoGenerator.Rendering;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>The catalogue light booth: plain pale sweep, one large soft box up-left, a rim light behind.</summary>
internal static class StudioStage
{
    private const double FieldOfView = 0.5;

    public static (Scene Scene, Camera Camera, FilmLook Look) Build(ShotSpec shot)
    {
        var part = PartPlacement.Place(shot.Part, shot.Pose, shot.Yaw, 0, 0);
        var key = new Vec3(-0.5, 0.78, 0.42).Normalized;
        var dome = new EnvironmentDome(
            Top: new Vec3(0.95, 0.95, 0.96),
            Horizon: new Vec3(0.42, 0.42, 0.43),
            GroundColour: new Vec3(0.58, 0.575, 0.565),
            SoftboxDirection: key,
            SoftboxColour: new Vec3(2.6, 2.6, 2.55),
            RimDirection: new Vec3(0.55, 0.35, -0.75).Normalized,
            RimColour: new Vec3(1.3, 1.3, 1.35),
            FlagDirection: new Vec3(0.85, 0.1, 0.5).Normalized);
        var lighting = new Lighting(key, new Vec3(0.5, 0.5, 0.49), 7, new Vec3(0.42, 0.425, 0.44), dome);
        var ground = new StudioFloor
        {
            BackdropColour = new Vec3(0.70, 0.70, 0.69),
            FadeStart = part.Radius * 3,
            FadeEnd = part.Radius * 10,
        };
        var solid = new SceneObject(part.Shape, FinishInfo.Look(shot.Part.Finish), part.Centre, part.Radius);
        var scene = new Scene([solid], ground, lighting, part.Radius);
        double distance = Camera.DistanceToFrame(part.Radius, shot.Fill, FieldOfView);
        var camera = new Camera(part.Centre, 0, shot.Elevation, distance, FieldOfView);
        return (scene, camera, FilmLook.Studio);
    }
}

using Lookup.DemoGenerator.Parts;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// Everything that decides one rendered photo. <c>Key</c> names the shot and, with <c>Seed</c>, seeds all further
/// random choices (clutter, light, noise), so a shot renders the same alone or in the middle of a full run.
/// <c>Yaw</c> turns the part about the vertical; <c>Elevation</c> is the camera's angle above the bench (radians);
/// <c>Fill</c> is the share of the frame height the part's bounding sphere spans.
/// </summary>
internal sealed record ShotSpec(
    string Key,
    int Seed,
    PartSpec Part,
    ShotStyle Style,
    int Pose,
    double Yaw,
    double Elevation,
    double Fill,
    int Width,
    int Height);

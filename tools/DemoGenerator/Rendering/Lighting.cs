using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// One shadow-casting key light (a direction towards the light, colour, and the softness factor of its
/// shadow: smaller is softer), an ambient fill for diffuse surfaces, and the dome metals reflect.
/// </summary>
internal sealed record Lighting(Vec3 KeyDirection, Vec3 KeyColour, double ShadowSharpness, Vec3 AmbientColour, EnvironmentDome Dome);

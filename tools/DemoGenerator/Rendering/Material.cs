using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// Surface look. <c>Albedo</c> is the diffuse colour of a non-metal or the reflectance tint of a metal (linear RGB);
/// <c>Metallic</c> blends between the two; <c>Roughness</c> (0 mirror … 1 matte) widens reflections; the specular
/// highlight exponent is 2^<c>SpecularExponentLog2</c>.
/// </summary>
internal sealed record Material(Vec3 Albedo, double Metallic, double Roughness, int SpecularExponentLog2);

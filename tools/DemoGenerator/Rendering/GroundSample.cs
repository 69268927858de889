using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>What the ground looks like at one point: diffuse colour and a highlight of given strength and exponent 2^k.</summary>
internal readonly record struct GroundSample(Vec3 Albedo, double Specular, int SpecularExponentLog2);

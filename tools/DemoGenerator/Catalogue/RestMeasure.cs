using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>In a posed part's frame: its lowest point, and the centre and radius of a sphere around it.</summary>
internal sealed record RestMeasure(double LowestY, Vec3 Centre, double Radius);

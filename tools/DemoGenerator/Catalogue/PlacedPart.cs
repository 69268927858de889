using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>A part's solid in world space, resting on the bench, with a sphere that tightly holds it.</summary>
internal sealed record PlacedPart(Shape Shape, Vec3 Centre, double Radius);

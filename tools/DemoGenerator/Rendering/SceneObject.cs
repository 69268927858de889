using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>A solid placed in world space with its material and a bounding sphere that surely contains it.</summary>
internal sealed record SceneObject(Shape Shape, Material Material, Vec3 Centre, double Radius);

using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Shapes;

namespace Lookup.DemoGenerator.Parts;

/// <summary>
/// A part's solid in its own frame, a box (half sizes around the origin) that surely contains it, and the
/// rotations in which it can rest on a bench; the first is the catalogue's main view.
/// </summary>
internal sealed record PartModel(Shape Shape, Vec3 HalfExtents, IReadOnlyList<Mat3> RestPoses);

namespace Lookup.DemoGenerator.Parts;

/// <summary>
/// One part: its code, shape family, finish and main sizes in millimetres. What <c>Size</c>, <c>Length</c> and
/// <c>Count</c> mean depends on the kind (thread diameter and length for bolts, leg length for brackets, module
/// and teeth for gears, ...); <see cref="PartShapes"/> reads them.
/// </summary>
internal sealed record PartSpec(string Code, PartKind Kind, Finish Finish, double Size, double Length, int Count, string Description);

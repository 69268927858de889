namespace Lookup.DemoGenerator.Parts;

/// <summary>The shapes the generator can build. The last three are never in the catalogue (for "no match").</summary>
internal enum PartKind
{
    HexBolt,
    HexNut,
    FlatWasher,
    SpringWasher,
    AngleBracket,
    ButtHinge,
    PipeElbow,
    PipeTee,
    SpurGear,
    CoilSpring,
    VBeltPulley,
    EyeBolt,
    WingNut,
    SocketCapScrew,
    PipeCross,
}

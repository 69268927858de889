namespace Lookup.Store;

/// <summary>What a reviewer's decision is about.</summary>
public enum DecisionTarget
{
    /// <summary>Two photos (their pair key): never report them together as copies or look-alikes.</summary>
    Pair,

    /// <summary>A whole finding (its key): never report it again; its pairs are dismissed with it.</summary>
    Finding,
}

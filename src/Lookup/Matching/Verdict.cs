namespace Lookup.Matching;

/// <summary>How sure an answer is, from most to least certain. <see cref="VerdictNames"/> gives the words shown.</summary>
public enum Verdict
{
    /// <summary>The query's bytes equal a catalogue photo's (SHA-256).</summary>
    SameFile,

    /// <summary>The whole query photo is an edited or re-saved copy of a catalogue photo, clearly nearer than any other SKU.</summary>
    SamePhoto,

    /// <summary>Close enough to be the same part and clearly nearer than any other SKU.</summary>
    SamePart,

    /// <summary>Close enough, but another SKU is about as close: compare them with the part.</summary>
    Unsure,

    /// <summary>Nothing in the catalogue is close enough.</summary>
    NoMatch,
}

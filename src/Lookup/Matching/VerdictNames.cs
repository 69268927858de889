namespace Lookup.Matching;

/// <summary>The plain words each <see cref="Verdict"/> is shown and written as (tables, CSV and JSON alike).</summary>
public static class VerdictNames
{
    /// <summary>The words for <paramref name="verdict"/>: "same file", "same photo", "same part", "unsure", "no match".</summary>
    public static string Of(Verdict verdict) => verdict switch
    {
        Verdict.SameFile => "same file",
        Verdict.SamePhoto => "same photo",
        Verdict.SamePart => "same part",
        Verdict.Unsure => "unsure",
        _ => "no match",
    };

    /// <summary>The verdict whose words are <paramref name="name"/>, or null.</summary>
    public static Verdict? Parse(string name) =>
        Enum.GetValues<Verdict>().Cast<Verdict?>().FirstOrDefault(v => Of(v!.Value) == name);
}

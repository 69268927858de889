namespace Lookup.Imaging;

/// <summary>The stable script-facing name of each <see cref="PhotoRejectionReason"/>, used wherever a rejection is
/// written out as data (match failures, inspect's JSON).</summary>
internal static class PhotoRejectionCodes
{
    /// <summary>Kebab-case name of <paramref name="reason"/>: EmptyFile → empty-file, TooManyPixels → too-many-pixels.</summary>
    public static string Code(this PhotoRejectionReason reason) =>
        string.Concat(reason.ToString().Select((c, i) => i > 0 && char.IsUpper(c) ? "-" + char.ToLowerInvariant(c) : char.ToLowerInvariant(c).ToString()));
}

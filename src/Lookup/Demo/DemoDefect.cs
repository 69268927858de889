namespace Lookup.Demo;

/// <summary>A mistake planted in the demo catalogue, as <c>truth.json</c> records it.</summary>
/// <param name="Kind"><c>same-photo-two-skus</c>, <c>re-export-within-sku</c> or <c>wrong-part</c>.</param>
/// <param name="Files">The photos involved, relative to the demo folder, '/' separated.</param>
/// <param name="FiledUnder">The SKU each file is filed under.</param>
/// <param name="ActualSku">The SKU each file really shows.</param>
/// <param name="Note">The mistake in words.</param>
internal sealed record DemoDefect(
    string Kind,
    IReadOnlyList<string> Files,
    IReadOnlyList<string> FiledUnder,
    IReadOnlyList<string> ActualSku,
    string Note)
{
    /// <summary>One photo filed under two SKUs (a byte copy).</summary>
    public const string SamePhotoTwoSkus = "same-photo-two-skus";

    /// <summary>A photo exported again (re-encoded or shrunk) and kept beside the original in one SKU.</summary>
    public const string ReExportWithinSku = "re-export-within-sku";

    /// <summary>A photo of one part filed under another part's SKU.</summary>
    public const string WrongPart = "wrong-part";
}

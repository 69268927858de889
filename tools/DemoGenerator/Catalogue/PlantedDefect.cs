namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// A mistake deliberately put into the demo catalogue. <c>Files</c>, <c>FiledUnder</c> and <c>ActualSku</c> are
/// parallel lists: each file, the SKU whose folder it sits in, and the SKU whose part it really shows.
/// </summary>
internal sealed record PlantedDefect(string Kind, IReadOnlyList<string> Files, IReadOnlyList<string> FiledUnder, IReadOnlyList<string> ActualSku, string Note)
{
    public const string SamePhotoTwoSkus = "same-photo-two-skus";
    public const string ReExportWithinSku = "re-export-within-sku";
    public const string WrongPart = "wrong-part";
}

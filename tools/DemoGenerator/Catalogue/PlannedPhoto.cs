namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// One output file: its path relative to the output folder, the SKU it is filed under (null for field photos),
/// the SKU of the part it really shows (null for a part the supplier does not sell), and how to make it.
/// </summary>
internal sealed record PlannedPhoto(string File, string? FiledUnder, string? ShowsSku, PhotoRecipe Recipe, string Note);

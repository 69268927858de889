using System.Text;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>The demo folder's README.md: the invented scenario, the layout, the range and what was planted.</summary>
internal static class ReadmeText
{
    public static string Compose(CataloguePlan plan, string command)
    {
        var s = new StringBuilder();
        s.AppendLine($"# Demo catalogue: {SupplierRange.Supplier}");
        s.AppendLine();
        s.AppendLine($"Everything here is invented. {SupplierRange.Supplier} is a made-up fastener and fittings wholesaler on the");
        s.AppendLine($"harbour road of {SupplierRange.Town}, a made-up town. Its counter staff photograph every stocked part in a light");
        s.AppendLine("booth and file the photos by SKU; tradespeople send snapshots of a part on their bench and ask \"do you stock this?\".");
        s.AppendLine("Both kinds of photo are rendered by `tools/DemoGenerator` (a small ray marcher), not photographed.");
        s.AppendLine();
        s.AppendLine("Regenerate (same seed, same bytes; checked by `tests/Lookup.Tests/Demo` on the project's machine):");
        s.AppendLine();
        s.AppendLine("```");
        s.AppendLine(command);
        s.AppendLine("```");
        s.AppendLine();
        s.AppendLine("## Layout");
        s.AppendLine($"- `photos/<SKU>/<SKU>_<n>.jpg`: catalogue views, {CataloguePlan.CatalogueSide}×{CataloguePlan.CatalogueSide}, JPEG quality {CataloguePlan.CatalogueQuality}; the folder name is the SKU.");
        s.AppendLine("- `catalogue.csv`: the same mapping as `file,sku` rows, paths relative to this folder.");
        s.AppendLine($"- `field/bench-<nn>.jpg`: {plan.Field.Count} customer snapshots, {CataloguePlan.FieldWidth}×{CataloguePlan.FieldHeight}, JPEG quality {CataloguePlan.FieldQuality}; {plan.Field.Count(f => f.ShowsSku is null)} of them show parts the supplier does not stock.");
        s.AppendLine("- `truth.json`: the true SKU of every field photo (null when not stocked), the planted defects and the look-alike groups.");
        s.AppendLine();
        s.AppendLine("SKU codes read family-size-finish: `HB-M8x40-ZN` is a hex bolt M8 × 40 mm, zinc-plated. Finishes: ZN zinc-plated,");
        s.AppendLine("BO black oxide, BR brass, SS stainless.");
        s.AppendLine();
        s.AppendLine("## The range");
        s.AppendLine();
        s.AppendLine("| SKU | Part | Photos |");
        s.AppendLine("| --- | --- | --- |");
        foreach (var sku in SupplierRange.Skus)
        {
            s.AppendLine($"| {sku.Code} | {sku.Description} | {plan.Photos.Count(p => p.FiledUnder == sku.Code)} |");
        }

        s.AppendLine();
        s.AppendLine("## Planted mistakes");
        s.AppendLine();
        foreach (var d in plan.Defects)
        {
            s.AppendLine($"- **{d.Kind}**: {string.Join(", ", d.Files.Select(f => $"`{f}`"))}. {d.Note}");
        }

        s.AppendLine();
        s.AppendLine("Look-alike groups (SKUs that differ only in size or finish) are listed in `truth.json`.");
        s.AppendLine();
        s.AppendLine("## Safety");
        s.AppendLine();
        s.AppendLine("Visual similarity is not verification. Eye bolts are lifting gear and fittings carry pressure: confirm part numbers,");
        s.AppendLine("dimensions and ratings against the supplier's data, and follow local codes and licensed practice.");
        return s.ToString();
    }
}

namespace Lookup.Catalogue;

/// <summary>The SKU is the name of the folder that directly holds the photo (a/B-12/front.jpg → B-12).</summary>
internal sealed class FolderSkuMapping : SkuMapping
{
    /// <inheritdoc />
    public override string Spec => "folder";

    /// <inheritdoc />
    public override SkuMappingResult Map(IReadOnlyList<CatalogueEntry> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        var photos = new List<MappedEntry>(entries.Count);
        var problems = new List<MappingProblem>();
        foreach (var entry in entries)
        {
            var slash = entry.RelativePath.LastIndexOf('/');
            if (slash < 0)
            {
                photos.Add(new MappedEntry(entry, null));
                problems.Add(new MappingProblem(MappingProblemKind.Unmapped, ProblemSeverity.Error, entry.FullPath, null,
                    $"{entry.FullPath} sits directly in the catalogue folder, so it has no SKU folder; "
                    + "move it into a folder named after its SKU."));
                continue;
            }

            var folderStart = entry.RelativePath.LastIndexOf('/', slash - 1) + 1;
            photos.Add(new MappedEntry(entry, entry.RelativePath[folderStart..slash]));
        }

        return new SkuMappingResult(photos, problems);
    }
}

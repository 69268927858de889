namespace Lookup.Catalogue;

/// <summary>Every scanned entry with its SKU (or none), plus the problems met.</summary>
/// <param name="Photos">One item per scanned entry, in scan order; <see cref="MappedEntry.Sku"/> null when unmapped.</param>
/// <param name="Problems">Problems in a stable order: CSV rows by line, then photos by path.</param>
internal sealed record SkuMappingResult(IReadOnlyList<MappedEntry> Photos, IReadOnlyList<MappingProblem> Problems)
{
    /// <summary>The entries that received a SKU.</summary>
    public IEnumerable<MappedEntry> Mapped => Photos.Where(p => p.Sku is not null);

    /// <summary>True when at least one problem is an error.</summary>
    public bool HasErrors => Problems.Any(p => p.Severity == ProblemSeverity.Error);
}

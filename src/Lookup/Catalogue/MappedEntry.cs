namespace Lookup.Catalogue;

/// <summary>A scanned file with the SKU a mapping gave it.</summary>
/// <param name="Entry">The scanned file.</param>
/// <param name="Sku">The SKU, or null when the file could not be mapped (a problem says why; never guessed).</param>
internal sealed record MappedEntry(CatalogueEntry Entry, string? Sku);

using System.Diagnostics.CodeAnalysis;

namespace Lookup.Catalogue;

/// <summary>
/// A rule that gives each scanned photo its SKU. Option specs: <c>folder</c> (the default: the name of the
/// folder holding the photo), <c>csv:FILE</c> (a <c>file,sku</c> table), <c>pattern:REGEX</c> (a .NET regular
/// expression with a group named <c>sku</c>, matched against the path relative to the root).
/// </summary>
internal abstract class SkuMapping
{
    /// <summary>The spec this mapping was made from, for logs and the index metadata.</summary>
    public abstract string Spec { get; }

    /// <summary>Gives each entry its SKU; unmappable entries get null and a problem, never a guess.</summary>
    public abstract SkuMappingResult Map(IReadOnlyList<CatalogueEntry> entries);

    /// <summary>Parses an option spec; a relative CSV path is taken from <paramref name="baseDirectory"/>.</summary>
    /// <exception cref="SkuMappingException">The spec is not valid; the message says why and how to fix it.</exception>
    public static SkuMapping Parse(string? spec, string baseDirectory) =>
        TryParse(spec, baseDirectory, out var mapping, out var error) ? mapping : throw new SkuMappingException(error);

    /// <summary>Parses an option spec, returning a readable error instead of throwing.</summary>
    public static bool TryParse(string? spec, string baseDirectory,
        [NotNullWhen(true)] out SkuMapping? mapping, [NotNullWhen(false)] out string? error)
    {
        ArgumentNullException.ThrowIfNull(baseDirectory);
        mapping = null;
        var text = spec?.Trim() ?? "";
        var colon = text.IndexOf(':', StringComparison.Ordinal);
        var kind = colon < 0 ? text : text[..colon];
        var argument = colon < 0 ? null : text[(colon + 1)..];
        error = kind.ToUpperInvariant() switch
        {
            "" => "the SKU mapping is empty; use folder, csv:FILE or pattern:REGEX",
            "FOLDER" when argument is null => null,
            "FOLDER" => $"'{text}': folder takes no argument; write just folder",
            "CSV" => CsvSkuMapping.TryCreate(argument, baseDirectory, out mapping),
            "PATTERN" => PatternSkuMapping.TryCreate(argument, out mapping),
            _ => $"'{text}' is not a SKU mapping; use folder, csv:FILE or pattern:REGEX",
        };
        if (error is null)
        {
            mapping ??= new FolderSkuMapping();
            return true;
        }

        mapping = null;
        return false;
    }
}

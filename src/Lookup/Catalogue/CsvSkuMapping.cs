using System.Diagnostics.CodeAnalysis;

namespace Lookup.Catalogue;

/// <summary>
/// SKUs from a CSV table (RFC 4180) whose header names a <c>file</c> and a <c>sku</c> column (any order, any
/// case; other columns are ignored). A file cell is a path relative to the CSV file's own folder, or absolute;
/// a backslash and a slash both separate folders.
/// Several rows may give photos the same SKU. Cells are trimmed of surrounding spaces. SKUs compare ordinally.
/// </summary>
internal sealed partial class CsvSkuMapping : SkuMapping
{
    private const string FileColumn = "file";
    private const string SkuColumn = "sku";

    private readonly string _csvPath;

    private CsvSkuMapping(string csvPath) => _csvPath = csvPath;

    /// <inheritdoc />
    public override string Spec => "csv:" + _csvPath;

    internal static string? TryCreate(string? argument, string baseDirectory, [NotNullWhen(true)] out SkuMapping? mapping)
    {
        mapping = null;
        if (string.IsNullOrWhiteSpace(argument))
        {
            return "csv: needs the path of a table with the columns file,sku, for example csv:skus.csv";
        }

        string fullPath;
        try
        {
            fullPath = Path.GetFullPath(argument.Trim(), Path.GetFullPath(baseDirectory));
        }
        catch (ArgumentException e)
        {
            return $"'{argument}' is not a usable path ({e.Message}); check the path after csv:";
        }

        if (!File.Exists(fullPath))
        {
            return $"the SKU table {fullPath} does not exist; check the path after csv:";
        }

        mapping = new CsvSkuMapping(fullPath);
        return null;
    }

    /// <inheritdoc />
    /// <exception cref="SkuMappingException">The CSV file cannot be read or its header names no file and sku column.</exception>
    public override SkuMappingResult Map(IReadOnlyList<CatalogueEntry> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        var records = CsvRecordReader.Read(ReadText());
        var header = ReadHeader(records);
        var table = new Table(this, header);
        foreach (var record in records.Skip(header.Index + 1))
        {
            table.Add(record);
        }

        return table.Resolve(entries);
    }

    private string ReadText()
    {
        try
        {
            return File.ReadAllText(_csvPath);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new SkuMappingException($"the SKU table {_csvPath} cannot be read ({e.Message}); check that it exists and is readable.");
        }
    }

    private Header ReadHeader(IReadOnlyList<CsvRecord> records)
    {
        var index = 0;
        while (index < records.Count && IsBlank(records[index]))
        {
            index++;
        }

        if (index == records.Count)
        {
            throw new SkuMappingException($"the SKU table {_csvPath} is empty; its first line must be the header file,sku.");
        }

        var first = records[index];
        var names = first.Fields.Select(f => f.Trim()).ToList();
        var fileColumn = names.FindIndex(n => n.Equals(FileColumn, StringComparison.OrdinalIgnoreCase));
        var skuColumn = names.FindIndex(n => n.Equals(SkuColumn, StringComparison.OrdinalIgnoreCase));
        if (first.Error is not null || fileColumn < 0 || skuColumn < 0)
        {
            throw new SkuMappingException(
                $"{_csvPath} line {first.Line}: the header must name the columns {FileColumn} and {SkuColumn} "
                + $"(found: {string.Join(",", names)}); add the line {FileColumn},{SkuColumn} at the top.");
        }

        return new Header(index, names.Count, fileColumn, skuColumn);
    }

    private static bool IsBlank(CsvRecord record) =>
        record.Error is null && record.Fields.Count == 1 && string.IsNullOrWhiteSpace(record.Fields[0]);

    /// <summary>Where the header sits and which columns hold the file and the SKU.</summary>
    private sealed record Header(int Index, int FieldCount, int FileColumn, int SkuColumn);
}

namespace Lookup.Catalogue;

/// <summary>One record of a CSV text.</summary>
/// <param name="Line">The 1-based line the record starts on.</param>
/// <param name="Fields">The unquoted field values (what was read up to an error, when there is one).</param>
/// <param name="Error">Why the record is malformed, or null.</param>
internal sealed record CsvRecord(int Line, IReadOnlyList<string> Fields, string? Error);

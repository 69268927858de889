namespace Lookup.Catalogue;

/// <summary>One problem found while mapping photos to SKUs.</summary>
/// <param name="Kind">The kind of problem.</param>
/// <param name="Severity">Error when a photo is left without a SKU or a row is unusable; warning otherwise.</param>
/// <param name="Path">The photo's absolute path, or the CSV file's for rows that name no usable file.</param>
/// <param name="Line">The CSV line the problem is on, or null.</param>
/// <param name="Message">A sentence naming the file, the line and the fix.</param>
internal sealed record MappingProblem(
    MappingProblemKind Kind,
    ProblemSeverity Severity,
    string? Path,
    int? Line,
    string Message);

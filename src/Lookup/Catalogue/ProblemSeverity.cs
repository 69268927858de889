namespace Lookup.Catalogue;

/// <summary>Whether a problem leaves a photo without a SKU (error) or only deserves attention (warning).</summary>
internal enum ProblemSeverity
{
    Warning,
    Error,
}

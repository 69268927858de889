using Lookup.Matching;

namespace Lookup.Cli;

/// <summary>The parsed options of <c>lookup match</c>.</summary>
internal sealed record MatchOptions(
    IReadOnlyList<string> Photos,
    string Index,
    int Top,
    CropSet Crops,
    bool Each,
    string? Like,
    bool Json,
    bool Csv,
    int Workers,
    string? Model);

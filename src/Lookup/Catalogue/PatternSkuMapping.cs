using System.Diagnostics.CodeAnalysis;
using System.Text.RegularExpressions;

namespace Lookup.Catalogue;

/// <summary>
/// The SKU is the text captured by the group named <c>sku</c> of a .NET regular expression, searched in the path
/// relative to the root with '/' separators (so a pattern can use folder names as well as file names). The match
/// need not cover the whole path; anchor with ^ and $ when it must. A photo that does not match, or whose
/// <c>sku</c> group captures nothing, is reported unmapped.
/// </summary>
internal sealed class PatternSkuMapping : SkuMapping
{
    /// <summary>The name of the capture group that holds the SKU.</summary>
    public const string GroupName = "sku";

    // A pattern runs once per photo; a second per path is far beyond any sane pattern and stops a runaway
    // backtracking pattern from stalling an ingest.
    private static readonly TimeSpan MatchTimeout = TimeSpan.FromSeconds(1);

    private readonly Regex _regex;

    private PatternSkuMapping(Regex regex) => _regex = regex;

    /// <inheritdoc />
    public override string Spec => "pattern:" + _regex;

    internal static string? TryCreate(string? pattern, [NotNullWhen(true)] out SkuMapping? mapping)
    {
        mapping = null;
        if (string.IsNullOrEmpty(pattern))
        {
            return "pattern: needs a regular expression with a group named sku, for example pattern:^(?<sku>[A-Z0-9-]+)_";
        }

        Regex regex;
        try
        {
            regex = new Regex(pattern, RegexOptions.CultureInvariant, MatchTimeout);
        }
        catch (ArgumentException e)
        {
            return $"pattern '{pattern}' is not a valid .NET regular expression: {e.Message}";
        }

        if (!regex.GetGroupNames().Contains(GroupName, StringComparer.Ordinal))
        {
            return $"pattern '{pattern}' has no group named {GroupName}; mark the SKU part as (?<{GroupName}>...)";
        }

        mapping = new PatternSkuMapping(regex);
        return null;
    }

    /// <inheritdoc />
    public override SkuMappingResult Map(IReadOnlyList<CatalogueEntry> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        var photos = new List<MappedEntry>(entries.Count);
        var problems = new List<MappingProblem>();
        foreach (var entry in entries)
        {
            var (sku, why) = MatchOne(entry.RelativePath);
            photos.Add(new MappedEntry(entry, sku));
            if (why is not null)
            {
                problems.Add(new MappingProblem(MappingProblemKind.Unmapped, ProblemSeverity.Error, entry.FullPath, null,
                    $"{entry.FullPath}: {why}"));
            }
        }

        return new SkuMappingResult(photos, problems);
    }

    private (string? Sku, string? Why) MatchOne(string relativePath)
    {
        Match match;
        try
        {
            match = _regex.Match(relativePath);
        }
        catch (RegexMatchTimeoutException)
        {
            return (null, $"matching '{relativePath}' against the pattern took over {MatchTimeout.TotalSeconds:0} s; simplify the pattern");
        }

        if (!match.Success)
        {
            return (null, $"'{relativePath}' does not match the pattern {_regex}; rename the photo or adjust the pattern");
        }

        var sku = match.Groups[GroupName].Value.Trim();
        return sku.Length == 0
            ? (null, $"'{relativePath}' matches the pattern {_regex} but its {GroupName} group is empty; adjust the pattern")
            : (sku, null);
    }
}

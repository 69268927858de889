using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

/// <summary>The synthetic catalogue with SKUs and paths chosen to break careless output (test data only).</summary>
internal static class HostileCatalogue
{
    public static readonly Dictionary<string, string> Skus = new(StringComparer.Ordinal)
    {
        ["A"] = "=HYPERLINK(\"http://example.invalid\",\"x\")",
        ["B"] = "<script>alert('b')</script>",
        ["C"] = "+C & \"quoted\"",
        ["D"] = "-D",
        ["E"] = "@SUM(A1)",
        ["F"] = "Ölfilter Ø12 – 日本",
        ["G"] = "G'single'",
        ["H"] = "H",
    };

    public static SweepReport Report()
    {
        var photos = SyntheticCatalogue.Build()
            .Select(p => p with { Sku = Skus[p.Sku], Path = $"{Skus[p.Sku]}/<img src=x onerror=alert(1)> & \"{p.Path}\"" })
            .ToList();
        return SweepEngine.Run(photos, new ExactNeighbourSource(photos));
    }
}

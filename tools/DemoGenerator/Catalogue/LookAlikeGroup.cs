namespace Lookup.DemoGenerator.Catalogue;

/// <summary>SKUs a clerk could easily confuse on a photo, and why.</summary>
internal sealed record LookAlikeGroup(string Reason, IReadOnlyList<string> Skus);

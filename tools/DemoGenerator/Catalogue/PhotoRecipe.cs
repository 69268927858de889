namespace Lookup.DemoGenerator.Catalogue;

/// <summary>How a planned file's bytes come about.</summary>
internal abstract record PhotoRecipe;

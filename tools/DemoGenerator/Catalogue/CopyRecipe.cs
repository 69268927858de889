namespace Lookup.DemoGenerator.Catalogue;

/// <summary>The exact bytes of another planned file.</summary>
internal sealed record CopyRecipe(string SourceFile) : PhotoRecipe;

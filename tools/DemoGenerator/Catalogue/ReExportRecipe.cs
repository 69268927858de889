namespace Lookup.DemoGenerator.Catalogue;

/// <summary>Another planned file decoded and saved again at <c>Quality</c>, shrunk to <c>LongSide</c> pixels if given.</summary>
internal sealed record ReExportRecipe(string SourceFile, int Quality, int? LongSide) : PhotoRecipe;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>Render <c>Shot</c> and save it as JPEG at <c>Quality</c>.</summary>
internal sealed record RenderRecipe(ShotSpec Shot, int Quality) : PhotoRecipe;

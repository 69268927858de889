namespace Lookup.DemoGenerator.Catalogue;

/// <summary>Turns a plan's recipes into file bytes; copies and re-exports read the bytes made before them.</summary>
internal static class PhotoMaker
{
    public static byte[] Make(PlannedPhoto photo, IReadOnlyDictionary<string, byte[]> made) => photo.Recipe switch
    {
        RenderRecipe r => Render(r),
        CopyRecipe c => Source(made, c.SourceFile, photo.File),
        ReExportRecipe e => PhotoCodec.ReExport(Source(made, e.SourceFile, photo.File), e.Quality, e.LongSide),
        _ => throw new InvalidOperationException($"{photo.File}: unknown recipe {photo.Recipe.GetType().Name}."),
    };

    public static byte[] Render(RenderRecipe recipe)
    {
        using var image = ShotRenderer.Render(recipe.Shot);
        return PhotoCodec.EncodeJpeg(image, recipe.Quality);
    }

    private static byte[] Source(IReadOnlyDictionary<string, byte[]> made, string source, string file) =>
        made.TryGetValue(source, out var bytes)
            ? bytes
            : throw new InvalidOperationException($"{file} is made from {source}, which the plan has not produced yet; list sources first.");
}

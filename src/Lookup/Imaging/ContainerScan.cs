namespace Lookup.Imaging;

/// <summary>
/// What a walk over a file's container structure found: whether every declared part is present, and how many
/// frames or pages it declares. The walks exist because ImageSharp 2.1 decodes many truncated files without error,
/// filling the missing rows with black; a cut-off photo must be reported, not embedded.
/// </summary>
/// <param name="Complete">True when the structure reaches its end marker with every declared byte present.</param>
/// <param name="Frames">Frames or pages declared (at least 1 for a complete file).</param>
/// <param name="Problem">What is wrong when <paramref name="Complete"/> is false.</param>
/// <param name="LargestFrame">
/// The largest frame a format lets declare apart from its header (GIF image descriptors), or (0, 0): the header
/// size is not the only size a decoder allocates for, so both are held to the pixel limit.
/// </param>
internal readonly record struct ContainerScan(bool Complete, int Frames, string? Problem, (int Width, int Height) LargestFrame = default)
{
    public static ContainerScan Whole(int frames, (int Width, int Height) largestFrame = default) =>
        new(true, Math.Max(frames, 1), null, largestFrame);

    public static ContainerScan Broken(string problem) => new(false, 0, problem);
}

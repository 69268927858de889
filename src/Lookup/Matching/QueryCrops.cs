using SixLabors.ImageSharp;

namespace Lookup.Matching;

/// <summary>The regions of a query photo that a <see cref="CropSet"/> embeds; the first is always the whole photo.</summary>
internal static class QueryCrops
{
    /// <summary>Side of the standard crops as a share of the photo's short side.</summary>
    public const double StandardShare = 0.7;

    /// <summary>Side of the dense grid's crops as a share of the photo's short side.</summary>
    public const double GridShare = 0.45;

    /// <summary>Number of network runs a crop set costs per photo.</summary>
    public static int Count(CropSet set) => set switch
    {
        CropSet.None => 1,
        CropSet.Standard => 6,
        _ => 15,
    };

    /// <summary>The regions for a <paramref name="width"/> × <paramref name="height"/> photo, whole photo first.</summary>
    public static Rectangle[] For(int width, int height, CropSet set)
    {
        var regions = new List<Rectangle>(Count(set)) { new(0, 0, width, height) };
        int shortSide = Math.Min(width, height);
        if (set == CropSet.None || shortSide < 8)
        {
            return [.. regions];
        }

        int side = Side(shortSide, StandardShare);
        regions.Add(new Rectangle((width - side) / 2, (height - side) / 2, side, side));
        AddGrid(regions, width, height, side, 2);
        if (set == CropSet.Dense)
        {
            AddGrid(regions, width, height, Side(shortSide, GridShare), 3);
        }

        return [.. regions];
    }

    private static int Side(int shortSide, double share) => Math.Max(1, (int)Math.Round(shortSide * share));

    /// <summary>An n × n grid of squares spread evenly from edge to edge (n = 2 gives the four corners).</summary>
    private static void AddGrid(List<Rectangle> regions, int width, int height, int side, int n)
    {
        for (int row = 0; row < n; row++)
        {
            for (int column = 0; column < n; column++)
            {
                int x = (int)Math.Round((width - side) * column / (double)(n - 1));
                int y = (int)Math.Round((height - side) * row / (double)(n - 1));
                regions.Add(new Rectangle(x, y, side, side));
            }
        }
    }
}

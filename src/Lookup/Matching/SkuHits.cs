namespace Lookup.Matching;

/// <summary>What the graph searches found of one SKU: its photo nodes and the nearest hit's distance.</summary>
internal sealed class SkuHits
{
    public HashSet<int> Nodes { get; } = [];

    public float Nearest { get; private set; } = float.PositiveInfinity;

    public void Add(int node, float distance)
    {
        Nodes.Add(node);
        Nearest = Math.Min(Nearest, distance);
    }
}

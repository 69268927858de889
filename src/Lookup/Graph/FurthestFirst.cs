namespace Lookup.Graph;

/// <summary>Heap order with the largest distance on top (the bounded result set).</summary>
internal readonly struct FurthestFirst : IHeapOrder
{
    public static bool Before(float a, float b) => a > b;
}

namespace Lookup.Graph;

/// <summary>Heap order with the smallest distance on top (the candidate queue).</summary>
internal readonly struct ClosestFirst : IHeapOrder
{
    public static bool Before(float a, float b) => a < b;
}

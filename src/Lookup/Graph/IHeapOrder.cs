namespace Lookup.Graph;

/// <summary>Orders a <see cref="NeighbourHeap{TOrder}"/>; a struct type argument lets the JIT inline the comparison.</summary>
internal interface IHeapOrder
{
    /// <summary>True when distance <paramref name="a"/> belongs nearer the top than <paramref name="b"/>.</summary>
    static abstract bool Before(float a, float b);
}

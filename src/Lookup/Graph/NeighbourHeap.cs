namespace Lookup.Graph;

/// <summary>A binary heap of neighbours ordered by <typeparamref name="TOrder"/>; reused across searches, not thread-safe.</summary>
internal sealed class NeighbourHeap<TOrder>
    where TOrder : struct, IHeapOrder
{
    private Neighbour[] _items = new Neighbour[64];
    private int _count;

    public int Count => _count;

    /// <summary>The top element; the heap must not be empty.</summary>
    public Neighbour Top => _items[0];

    /// <summary>The elements in heap order (not sorted).</summary>
    public ReadOnlySpan<Neighbour> Items => _items.AsSpan(0, _count);

    public void Clear() => _count = 0;

    public void Push(Neighbour item)
    {
        if (_count == _items.Length)
        {
            Array.Resize(ref _items, _items.Length * 2);
        }

        var items = _items;
        int i = _count++;
        while (i > 0)
        {
            int parent = (i - 1) >> 1;
            if (!TOrder.Before(item.Distance, items[parent].Distance))
            {
                break;
            }

            items[i] = items[parent];
            i = parent;
        }

        items[i] = item;
    }

    public Neighbour Pop()
    {
        var items = _items;
        var top = items[0];
        var last = items[--_count];
        int n = _count;
        int i = 0;
        while (true)
        {
            int child = (2 * i) + 1;
            if (child >= n)
            {
                break;
            }

            if (child + 1 < n && TOrder.Before(items[child + 1].Distance, items[child].Distance))
            {
                child++;
            }

            if (!TOrder.Before(items[child].Distance, last.Distance))
            {
                break;
            }

            items[i] = items[child];
            i = child;
        }

        if (n > 0)
        {
            items[i] = last;
        }

        return top;
    }
}

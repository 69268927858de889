namespace Lookup.Graph;

/// <summary>A nearest-neighbour index that also accepts inserts and deletes (one writer at a time).</summary>
public interface INearestIndex : INearestSearch
{
    /// <summary>Stores a copy of <paramref name="vector"/>, normalised to unit length, and returns its id (= the previous Count).</summary>
    int Add(ReadOnlySpan<float> vector);

    /// <summary>Deletes <paramref name="id"/>: it is never returned again. Deleting twice is a no-op.</summary>
    void Delete(int id);
}

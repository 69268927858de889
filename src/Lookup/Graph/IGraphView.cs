namespace Lookup.Graph;

/// <summary>
/// The only way the search algorithms touch storage. Implemented by structs so each algorithm is compiled
/// once per storage and the accessors inline: <see cref="ArrayGraphView"/> over the in-memory arrays, and a
/// lazily loading view over the index file (Store/) that fetches the nodes a search visits.
/// </summary>
internal interface IGraphView
{
    /// <summary>Every id reachable through this view is below this limit (sizes the visited set).</summary>
    int NodeLimit { get; }

    /// <summary>The unit vector of <paramref name="id"/>.</summary>
    ReadOnlySpan<float> Vector(int id);

    /// <summary>The ids <paramref name="id"/> links to on <paramref name="level"/>.</summary>
    ReadOnlySpan<int> Links(int id, int level);

    /// <summary>True when <paramref name="id"/> is a tombstone: walked through, never returned.</summary>
    bool IsDeleted(int id);

    /// <summary>Hints that <paramref name="id"/>'s vector is about to be read (a cache prefetch; may do nothing).</summary>
    void Prefetch(int id);
}

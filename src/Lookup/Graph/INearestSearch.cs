namespace Lookup.Graph;

/// <summary>
/// Read side of a nearest-neighbour index over L2-normalised vectors with cosine distance d = 1 − dot.
/// Implementations state their thread-safety rule in their own doc comment.
/// </summary>
public interface INearestSearch
{
    /// <summary>Length of every vector.</summary>
    int Dimension { get; }

    /// <summary>Ids handed out so far (deleted ones included); ids run from 0 to Count − 1.</summary>
    int Count { get; }

    /// <summary>Ids not deleted.</summary>
    int LiveCount { get; }

    /// <summary>True when <paramref name="id"/> was deleted.</summary>
    bool IsDeleted(int id);

    /// <summary>The stored (unit-length) vector of <paramref name="id"/>.</summary>
    ReadOnlySpan<float> GetVector(int id);

    /// <summary>The <paramref name="k"/> nearest live ids, closest first.</summary>
    /// <param name="query">Any non-zero vector; it is normalised before use.</param>
    /// <param name="k">How many hits at most.</param>
    /// <param name="ef">Candidate list size; defaults to the index's EfSearch and is raised to k.</param>
    Neighbour[] Search(ReadOnlySpan<float> query, int k, int? ef = null);

    /// <summary>Every live id within cosine distance <paramref name="radius"/> of the query, closest first.</summary>
    Neighbour[] RangeSearch(ReadOnlySpan<float> query, float radius);
}

using System.Runtime.CompilerServices;

namespace Lookup.Graph;

/// <summary>
/// Nodes seen during one search, as generation tags: starting a search bumps the generation instead of
/// clearing the array, which is cleared only when the 16-bit tag wraps (hnswlib's visited_list_pool.h does the same).
/// One instance per thread (see <see cref="SearchScratch"/>); not thread-safe.
/// </summary>
internal sealed class VisitedSet
{
    private ushort[] _tags = [];
    private ushort _generation;

    /// <summary>Starts a new search over ids below <paramref name="nodeLimit"/>.</summary>
    public void Reset(int nodeLimit)
    {
        if (_tags.Length < nodeLimit)
        {
            _tags = new ushort[Math.Max(nodeLimit, _tags.Length * 2)];
            _generation = 0;
        }

        _generation++;
        if (_generation == 0)
        {
            Array.Clear(_tags);
            _generation = 1;
        }
    }

    /// <summary>Marks <paramref name="id"/> visited; false when it already was.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool TryVisit(int id)
    {
        ref ushort tag = ref _tags[id];
        if (tag == _generation)
        {
            return false;
        }

        tag = _generation;
        return true;
    }
}

using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>
/// Which version of a path a merge keeps. Records are keyed by relative path and compared by SHA-256:
/// <list type="bullet">
/// <item>Same bytes, one embedded and one failed: the embedded one wins (the failure was about that run, e.g. a
/// time limit on a busy node, not about the bytes).</item>
/// <item>Otherwise the record written later wins (<see cref="PhotoRecord.UpdatedUtc"/>, stamped by the ingest that
/// wrote it), so merging an old part after a new one cannot undo a change; on a tie the later part wins.</item>
/// </list>
/// A record equal to the target's in every field but the node id is left alone, which makes a repeated merge a no-op.
/// </summary>
internal static class MergeRules
{
    /// <summary>True when <paramref name="incoming"/> should take the place of <paramref name="current"/>.</summary>
    public static bool Supersedes(PhotoRecord incoming, PhotoRecord current)
    {
        if (SameContent(incoming, current) && incoming.Status != current.Status)
        {
            return incoming.Status == PhotoStatus.Indexed;
        }

        return incoming.UpdatedUtc >= current.UpdatedUtc;
    }

    /// <summary>Both records name the same bytes (equal, known SHA-256).</summary>
    public static bool SameContent(PhotoRecord a, PhotoRecord b) =>
        a.Sha256 is not null && string.Equals(a.Sha256, b.Sha256, StringComparison.Ordinal);

    /// <summary>Equal in every field except the node id (which is numbered per index file).</summary>
    public static bool SameRecord(PhotoRecord a, PhotoRecord b) =>
        a with { NodeId = null, Thumbnail = null, Detail = null, Chroma = null } == b with { NodeId = null, Thumbnail = null, Detail = null, Chroma = null }
        && (a.NodeId is null) == (b.NodeId is null)
        && (a.Thumbnail ?? []).AsSpan().SequenceEqual(b.Thumbnail ?? [])
        && (a.Detail is null) == (b.Detail is null) && (a.Detail ?? []).AsSpan().SequenceEqual(b.Detail ?? [])
        && (a.Chroma is null) == (b.Chroma is null) && (a.Chroma ?? []).AsSpan().SequenceEqual(b.Chroma ?? []);

    /// <summary>What to do with the winning record of a path, given what the target holds.</summary>
    public static MergeStepKind Decide(PhotoRecord winner, PhotoRecord? known)
    {
        if (known is null)
        {
            return MergeStepKind.Add;
        }

        if (SameRecord(winner, known))
        {
            return MergeStepKind.Unchanged;
        }

        if (!Supersedes(winner, known))
        {
            return MergeStepKind.Superseded;
        }

        return SameContent(winner, known) && winner.Status == PhotoStatus.Indexed && known.Status == PhotoStatus.Indexed
            ? MergeStepKind.Update
            : MergeStepKind.Replace;
    }
}

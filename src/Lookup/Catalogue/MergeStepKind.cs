namespace Lookup.Catalogue;

/// <summary>What a merge does with one path.</summary>
internal enum MergeStepKind
{
    /// <summary>The target does not know the path: insert the record (and its vector).</summary>
    Add,

    /// <summary>Newer, different content (or a failure turned into an embedding): retire the old node, insert the new one.</summary>
    Replace,

    /// <summary>Same content, newer record: rewrite the record, keep the node.</summary>
    Update,

    /// <summary>The target holds this record already.</summary>
    Unchanged,

    /// <summary>The target holds a newer version of the path.</summary>
    Superseded,
}

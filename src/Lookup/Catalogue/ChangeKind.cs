namespace Lookup.Catalogue;

/// <summary>What an ingest must do with one path; see <see cref="ChangePlanner"/> for the rules.</summary>
internal enum ChangeKind
{
    /// <summary>Same path, size and modification time as known. Not hashed; nothing to do.</summary>
    Unchanged,

    /// <summary>Same path and content (SHA-256 equal) but size or time differ: update the record's metadata only.</summary>
    Touched,

    /// <summary>Same path and content, a different SKU: update the record only (and its metadata if it differs).</summary>
    SkuChanged,

    /// <summary>Same path, different content: embed again and retire the old node.</summary>
    Changed,

    /// <summary>A path not known before whose content is not a moved photo's: embed.</summary>
    New,

    /// <summary>A new path holding a gone path's exact content: move the record and its node, no embedding.</summary>
    Moved,

    /// <summary>A known path that is no longer there: retire its record and node.</summary>
    Gone,

    /// <summary>A known path that is no longer there, kept because <see cref="ChangePlanOptions.KeepMissing"/> is set.</summary>
    Missing,

    /// <summary>A known path inside a folder or file the scan could not read: keep everything as it is.</summary>
    Unverified,

    /// <summary>A present file that could not be hashed: keep the known record if any, record the failure otherwise.</summary>
    HashFailed,
}

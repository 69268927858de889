namespace Lookup.Store;

/// <summary>Why an index file could not be used.</summary>
public enum IndexFileProblem
{
    /// <summary>The file does not exist.</summary>
    NotFound,

    /// <summary>The file is not a LiteDB file, is truncated, or has no Lookup metadata.</summary>
    NotAnIndex,

    /// <summary>The file was written by a newer Lookup with a schema this build does not know.</summary>
    NewerSchema,

    /// <summary>Another process (or another handle in this one) is the writer.</summary>
    WriterActive,

    /// <summary>The graph was built with another embedding model.</summary>
    ModelMismatch,

    /// <summary>The file holds no graph yet, or its graph metadata is inconsistent.</summary>
    NoGraph,

    /// <summary>The operating system refused access: a read-only file or folder, or one this user may not read.</summary>
    AccessDenied,

    /// <summary>A write failed under a commit (disk full, file-size limit, I/O error); earlier commits are kept.</summary>
    WriteFailed,
}

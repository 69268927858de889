namespace Lookup.Catalogue;

/// <summary>Why a part index was refused by a merge.</summary>
internal enum MergeProblem
{
    /// <summary>The part file does not exist.</summary>
    Missing,

    /// <summary>The part is the merge target itself, or was named twice by two spellings of one path.</summary>
    SameFile,

    /// <summary>The part has no catalogue settings or no graph: no ingest ever committed to it.</summary>
    NotIngested,

    /// <summary>The part was built with another embedding model (fingerprint differs).</summary>
    ModelMismatch,

    /// <summary>The part indexes another catalogue root.</summary>
    RootMismatch,

    /// <summary>The part maps photos to SKUs by another rule.</summary>
    SkuMappingMismatch,

    /// <summary>The part's graph has another dimension or other HNSW parameters.</summary>
    GraphMismatch,

    /// <summary>A photo record points at a graph node the part does not hold.</summary>
    Damaged,
}

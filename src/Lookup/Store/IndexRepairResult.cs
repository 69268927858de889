namespace Lookup.Store;

/// <summary>What <see cref="IndexChecker.Repair(IndexFile, bool)"/> did, and the check of the repaired file.</summary>
/// <param name="Before">The check that decided the repair.</param>
/// <param name="After">The check of the file after the repair committed (equal to <paramref name="Before"/> when nothing was done).</param>
/// <param name="GraphRebuilt">True when the graph was rebuilt from the stored vectors.</param>
/// <param name="NodesKept">Live nodes in the rebuilt graph (one per usable photo record).</param>
/// <param name="NodesDropped">Nodes of the old graph left out: retired, orphaned, or damaged.</param>
/// <param name="RecordsDropped">Photo records removed because their vector is lost or damaged; the next ingest embeds those photos again.</param>
/// <param name="DroppedPaths">The paths of those records, in path order.</param>
public sealed record IndexRepairResult(
    IndexCheckReport Before,
    IndexCheckReport After,
    bool GraphRebuilt,
    int NodesKept,
    int NodesDropped,
    int RecordsDropped,
    IReadOnlyList<string> DroppedPaths);

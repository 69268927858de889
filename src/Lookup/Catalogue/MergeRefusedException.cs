namespace Lookup.Catalogue;

/// <summary>A part index that cannot be merged, with a message naming the part, the values that differ and the fix.
/// Nothing has been written to the target when this is thrown.</summary>
internal sealed class MergeRefusedException(string partPath, MergeProblem problem, string message) : Exception(message)
{
    /// <summary>The offending part (or the target, for settings the target already holds).</summary>
    public string PartPath { get; } = partPath;

    /// <summary>What is wrong with it.</summary>
    public MergeProblem Problem { get; } = problem;
}

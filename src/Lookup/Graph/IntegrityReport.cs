namespace Lookup.Graph;

/// <summary>What <c>CheckIntegrity</c> found: counts of what was checked and one line per problem (at most 100 listed).</summary>
public sealed record IntegrityReport(int NodesChecked, int LinksChecked, int UnreachableLiveNodes, int ProblemCount, IReadOnlyList<string> Problems)
{
    /// <summary>True when no problem was found.</summary>
    public bool IsHealthy => ProblemCount == 0;

    /// <inheritdoc />
    public override string ToString() =>
        IsHealthy
            ? $"healthy: {NodesChecked} nodes, {LinksChecked} links"
            : $"{ProblemCount} problem(s) in {NodesChecked} nodes, {LinksChecked} links: {string.Join("; ", Problems)}";
}

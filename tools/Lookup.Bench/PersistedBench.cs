using Lookup.Graph;

namespace Lookup.Bench;

/// <summary>Placeholder until the store lands: reports nothing measured.</summary>
internal sealed record PersistedBench(int Count, double OpenMilliseconds, double ColdQueryMilliseconds)
{
    public static PersistedBench Run(HnswGraph graph, float[][] queries, bool quick) => new(0, double.NaN, double.NaN);

    public void Print() => Console.WriteLine("persisted: not measured");
}

namespace Lookup.Bench;

/// <summary>One line of the graph bench table.</summary>
internal sealed record ResultRow(string Dataset, string Engine, int Count, double BuildSeconds, int Ef, double Recall, double Qps)
{
    public double BuildRate => BuildSeconds > 0 ? Count / BuildSeconds : 0;
}

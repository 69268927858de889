namespace Lookup.Bench;

/// <summary>
/// Benchmarks and data tools. Usage:
///   dotnet run -c Release --project tools/Lookup.Bench -- graph [--quick]
///   dotnet run -c Release --project tools/Lookup.Bench -- extract-fashion-mnist [--count 2000]
/// </summary>
internal static class Program
{
    private static int Main(string[] args)
    {
        string command = args.Length > 0 ? args[0] : "";
        bool quick = args.Contains("--quick");
        return command switch
        {
            "graph" => GraphBench.Run(quick),
            "extract-fashion-mnist" => ExtractFashionMnist.Run(args),
            _ => Usage(),
        };
    }

    private static int Usage()
    {
        Console.Error.WriteLine("usage: Lookup.Bench graph [--quick] | extract-fashion-mnist [--count N]");
        return 2;
    }
}

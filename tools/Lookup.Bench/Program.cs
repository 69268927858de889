namespace Lookup.Bench;

/// <summary>
/// Benchmarks and data tools. Usage:
///   dotnet run -c Release --project tools/Lookup.Bench -- graph [--quick]
///   dotnet run -c Release --project tools/Lookup.Bench -- params [--quick]   (M × EfConstruction × EfSearch sweep)
///   dotnet run -c Release --project tools/Lookup.Bench -- persisted         (re-measure open + first query on the last saved 100k file)
///   dotnet run -c Release --project tools/Lookup.Bench -- kernel            (dot-product kernel vs TensorPrimitives)
///   dotnet run -c Release --project tools/Lookup.Bench -- crash-test [--rounds 8]   (kill -9 a writer, reopen, check)
///   dotnet run -c Release --project tools/Lookup.Bench -- merge [--quick] [--parts 4]   (lookup merge of 100k stored vectors)
///   dotnet run -c Release --project tools/Lookup.Bench -- fuzz [--cases 20000] [--seed 1]   (byte-mutation fuzz of the photo decoder)
///   dotnet run -c Release --project tools/Lookup.Bench -- ingest [--quick] [--photos 10000] [--per-size 48] [--rounds 3] [--only speed|memory]
///   dotnet run -c Release --project tools/Lookup.Bench -- match-stages --index FILE --photo PHOTO [--crops dense]   (where one match's time goes)
///   dotnet run -c Release --project tools/Lookup.Bench -- onnx-load [--runs 5]   (session open and inference per ORT optimisation level)
///   dotnet run -c Release --project tools/Lookup.Bench -- prepare          (embeds and caches the bench vectors)
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
            "prepare" => Prepare(),
            "kernel" => KernelBench.Run(),
            "params" => ParameterSweep.Run(quick),
            "persisted" => PersistedBench.Reopen(),
            "crash-test" => CrashTest.Run(args),
            "merge" => MergeBench.Run(args),
            "fuzz" => FuzzBench.Run(args),
            "ingest" => IngestBench.Run(args),
            "match-stages" => MatchStages.Run(args),
            "onnx-load" => OnnxLoadBench.Run(args),

            "sweep" => SweepBench.Run(quick),
            "ingest-memory-child" => IngestBench.MemoryChild(args),
            "crash-writer" => CrashTest.Writer(args[1], int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture)),
            _ => Usage(),
        };
    }

    /// <summary>Computes and caches the embeddings the full graph bench uses (slow once: ResNet18 on 11,000 images).</summary>
    private static int Prepare()
    {
        _ = Datasets.Real("train", 10_000);
        _ = Datasets.Real("t10k", 1_000);
        return 0;
    }

    private static int Usage()
    {
        Console.Error.WriteLine("usage: Lookup.Bench graph [--quick] | params [--quick] | persisted | kernel | crash-test [--rounds N] | merge [--quick] [--parts N] | ingest [--quick] [--photos N] [--per-size N] [--rounds N] [--only speed|memory] | match-stages --index FILE --photo PHOTO [--crops C] | onnx-load [--runs N] | fuzz [--cases N] [--seed S] | sweep [--quick] | prepare | extract-fashion-mnist [--count N]");
        return 2;
    }
}

using System.Diagnostics;
using System.Globalization;
using Lookup.Embedding;
using Microsoft.ML.OnnxRuntime;
using Microsoft.ML.OnnxRuntime.Tensors;

namespace Lookup.Bench;

/// <summary>
/// What opening the default network costs under each ONNX Runtime graph optimisation level, and what each level
/// does to one inference: the session open is on the critical path of every <c>lookup match</c>, the inference on
/// every photo. Also a model saved after optimisation (<see cref="SessionOptions.OptimizedModelFilePath"/>) and
/// opened with optimisation off, as a cache would. One intra-op thread, Lookup's other session settings.
/// Usage: <c>onnx-load [--runs 5]</c>.
/// </summary>
internal static class OnnxLoadBench
{
    public static int Run(string[] args)
    {
        int at = Array.IndexOf(args, "--runs");
        int runs = at >= 0 ? int.Parse(args[at + 1], CultureInfo.InvariantCulture) : 5;
        var card = ModelCard.Default;
        string optimised = Path.Combine(Path.GetTempPath(), "lookup-bench-resnet18.optimised.onnx");
        using (var saving = OnnxSessions.CreateOptions(1))
        {
            saving.OptimizedModelFilePath = optimised;
            using var _ = new InferenceSession(card.OnnxFile, saving);
        }

        (string Name, string File, GraphOptimizationLevel Level)[] variants =
        [
            ("ORT_ENABLE_ALL (shipped)", card.OnnxFile, GraphOptimizationLevel.ORT_ENABLE_ALL),
            ("ORT_ENABLE_EXTENDED", card.OnnxFile, GraphOptimizationLevel.ORT_ENABLE_EXTENDED),
            ("ORT_ENABLE_BASIC", card.OnnxFile, GraphOptimizationLevel.ORT_ENABLE_BASIC),
            ("ORT_DISABLE_ALL", card.OnnxFile, GraphOptimizationLevel.ORT_DISABLE_ALL),
            ("saved optimised model, ORT_DISABLE_ALL", optimised, GraphOptimizationLevel.ORT_DISABLE_ALL),
        ];
        var input = new DenseTensor<float>(new float[3 * card.InputSize * card.InputSize], [1, 3, card.InputSize, card.InputSize]);
        Console.WriteLine($"onnx-load: {card.OnnxFile} ({new FileInfo(card.OnnxFile).Length / 1e6:0.0} MB), {runs} opens and 20 inferences per variant (medians), load {File.ReadAllText("/proc/loadavg").Split(' ')[0]}");
        Console.WriteLine();
        Console.WriteLine("| session | open wall ms | open CPU ms | inference wall ms | inference CPU ms |");
        Console.WriteLine("| --- | ---: | ---: | ---: | ---: |");
        foreach (var (name, file, level) in variants)
        {
            var opens = new List<(double Wall, double Cpu)>();
            var inferences = new List<(double Wall, double Cpu)>();
            for (int r = 0; r < runs; r++)
            {
                using var options = OnnxSessions.CreateOptions(1);
                options.GraphOptimizationLevel = level;
                var (session, open) = Timed(() => new InferenceSession(file, options));
                opens.Add(open);
                using (session)
                {
                    var feed = new[] { NamedOnnxValue.CreateFromTensor(card.InputName, input) };
                    for (int i = 0; i < (r == 0 ? 22 : 0); i++)
                    {
                        var (_, one) = Timed(() =>
                        {
                            using var results = session.Run(feed);
                            return 0;
                        });
                        if (i >= 2)
                        {
                            inferences.Add(one);
                        }
                    }
                }
            }

            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"| {name} | {Median(opens.Select(o => o.Wall)):0} | {Median(opens.Select(o => o.Cpu)):0} | {Median(inferences.Select(o => o.Wall)):0.0} | {Median(inferences.Select(o => o.Cpu)):0.0} |"));
        }

        File.Delete(optimised);
        return 0;
    }

    private static (T Value, (double Wall, double Cpu) Cost) Timed<T>(Func<T> action)
    {
        double cpu = CpuClock.ProcessMs();
        long start = Stopwatch.GetTimestamp();
        var value = action();
        return (value, (Stopwatch.GetElapsedTime(start).TotalMilliseconds, CpuClock.ProcessMs() - cpu));
    }

    private static double Median(IEnumerable<double> values)
    {
        var sorted = values.Order().ToList();
        return sorted[sorted.Count / 2];
    }
}

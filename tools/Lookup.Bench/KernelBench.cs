using System.Diagnostics;
using System.Globalization;
using System.Numerics.Tensors;
using Lookup.Graph;

namespace Lookup.Bench;

/// <summary>`kernel`: nanoseconds per dot product of our kernel and of TensorPrimitives.Dot, on vectors that fit in cache and on ones that do not.</summary>
internal static class KernelBench
{
    public static int Run()
    {
        foreach (int dimension in new[] { 64, 512 })
        {
            foreach (int count in new[] { 64, 100_000 })
            {
                var data = new float[count * dimension];
                var random = new Random(1);
                for (int i = 0; i < data.Length; i++)
                {
                    data[i] = (float)random.NextDouble();
                }

                var order = Enumerable.Range(0, 2_000_000).Select(_ => random.Next(count)).ToArray();
                double ours = Time(data, dimension, order, static (a, b) => CosineKernel.Dot(a, b));
                double library = Time(data, dimension, order, static (a, b) => TensorPrimitives.Dot(a, b));
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"dim {dimension,4}, {count,7} vectors: ours {ours,6:F1} ns, TensorPrimitives.Dot {library,6:F1} ns"));
            }
        }

        return 0;
    }

    private delegate float DotFunction(ReadOnlySpan<float> a, ReadOnlySpan<float> b);

    private static double Time(float[] data, int dimension, int[] order, DotFunction dot)
    {
        float sink = 0;
        var query = data.AsSpan(0, dimension).ToArray();
        for (int round = 0; round < 2; round++)
        {
            var watch = Stopwatch.StartNew();
            foreach (int id in order)
            {
                sink += dot(query, data.AsSpan(id * dimension, dimension));
            }

            if (round == 1)
            {
                GC.KeepAlive(sink);
                return watch.Elapsed.TotalNanoseconds / order.Length;
            }
        }

        return 0;
    }
}

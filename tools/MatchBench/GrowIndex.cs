using System.Diagnostics;
using System.Globalization;
using Lookup.Store;

namespace MatchBench;

/// <summary>
/// Grows an ingested index to a given number of photos without embedding anything: each synthetic SKU takes the
/// vector of a real indexed photo and gets three photos, each that vector plus N(0, σ²) per component, renormalised
/// (σ = 0.02 puts a copy about 0.1 from its source, like another view of the part). Photo records carry random
/// SHA-256 and dHash values, so none of them is an identical file. For the latency benchmark only: the graph then
/// has the size and shape of a large catalogue, and a query walks it as it would walk a real one.
/// </summary>
internal static class GrowIndex
{
    private const int Batch = 5_000;

    public static int Run(Arguments args)
    {
        string path = args.Get("index");
        int target = args.Int("to", 100_000);
        var random = new Random(args.Int("seed", 7));
        float noise = (float)args.Double("noise", 0.02);
        var clock = Stopwatch.StartNew();
        using var file = IndexFile.Open(path, IndexAccess.Write);
        var store = new GraphStore(file);
        var graph = store.Load(store.ModelFingerprint);
        var photos = new PhotoTable(file);
        var sources = photos.All().Where(r => r.Status == PhotoStatus.Indexed && r.NodeId is not null)
            .Select(r => graph.GetVector(r.NodeId!.Value).ToArray()).ToList();
        int dimension = graph.Dimension;
        int added = 0, sku = 0;
        var vector = new float[dimension];
        while (graph.LiveCount < target)
        {
            file.InTransaction(() =>
            {
                for (int i = 0; i < Batch && graph.LiveCount < target; i += 3, sku++)
                {
                    var source = sources[random.Next(sources.Count)];
                    string name = $"SYN-{sku:D6}";
                    for (int view = 1; view <= 3 && graph.LiveCount < target; view++)
                    {
                        for (int d = 0; d < dimension; d++)
                        {
                            vector[d] = source[d] + (noise * Gaussian(random));
                        }

                        int node = graph.Add(vector);
                        photos.Upsert(Record($"synthetic/{name}/{name}_{view}.jpg", name, node, random));
                        added++;
                    }
                }

                store.Commit(graph);
            });
            Console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{graph.LiveCount:N0} photos ({clock.Elapsed.TotalSeconds:0} s)"));
        }

        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{path}: added {added:N0} synthetic photos in {sku:N0} SKUs; {graph.LiveCount:N0} indexed; {clock.Elapsed.TotalSeconds:0.0} s"));
        return 0;
    }

    private static PhotoRecord Record(string path, string sku, int node, Random random)
    {
        var sha = new byte[32];
        random.NextBytes(sha);
        return new PhotoRecord
        {
            Path = path,
            Sku = sku,
            Size = 40_000,
            MtimeUtcTicks = 0,
            Sha256 = Convert.ToHexStringLower(sha),
            Status = PhotoStatus.Indexed,
            NodeId = node,
            Width = 384,
            Height = 384,
            Format = "Jpeg",
            DHash = (ulong)random.NextInt64(),
            UpdatedUtc = DateTime.UnixEpoch,
        };
    }

    /// <summary>Standard normal by Box–Muller.</summary>
    private static float Gaussian(Random random) =>
        (float)(Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble()));
}

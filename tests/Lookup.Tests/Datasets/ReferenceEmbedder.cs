using Microsoft.ML.OnnxRuntime;
using Microsoft.ML.OnnxRuntime.Tensors;

namespace Lookup.Tests.Datasets;

/// <summary>
/// A minimal, private ResNet18 feature extractor for 28×28 grey reference images, used by the graph tests and
/// the bench until the product's embedder lands; swap it for that one then. Pipeline: upscale to 224×224
/// (bilinear), grey into all three RGB planes in 0..255, ResNetPreprocess.onnx (OriginalInput →
/// PreprocessedInput), ResNet18.onnx (Input247 → Pooling395_Output_0, the 512-float global average pool).
/// Both ONNX files ship with every build output under DnnImageModels/. Not thread-safe: one instance per thread.
/// </summary>
internal sealed class ReferenceEmbedder : IDisposable
{
    public const int Dimension = 512;
    private const int Size = 224;

    private readonly InferenceSession _preprocess;
    private readonly InferenceSession _network;
    private readonly float[] _input = new float[3 * Size * Size];

    public ReferenceEmbedder(int intraOpThreads = 1)
    {
        string models = Path.Combine(AppContext.BaseDirectory, "DnnImageModels");
        var options = new SessionOptions { IntraOpNumThreads = intraOpThreads, InterOpNumThreads = 1 };
        _preprocess = new InferenceSession(Path.Combine(models, "ResNetPrepOnnx", "ResNetPreprocess.onnx"), options);
        _network = new InferenceSession(Path.Combine(models, "ResNet18Onnx", "ResNet18.onnx"), options);
    }

    /// <summary>The 512-float embedding of one 28×28 grey image (not normalised).</summary>
    public float[] Embed(byte[] grey)
    {
        Upscale(grey, _input);
        var original = new DenseTensor<float>(_input, [1, 3, Size, Size]);
        using var prepared = _preprocess.Run([NamedOnnxValue.CreateFromTensor("OriginalInput", original)]);
        var preprocessed = prepared.First(v => v.Name == "PreprocessedInput").AsTensor<float>();
        using var output = _network.Run([NamedOnnxValue.CreateFromTensor("Input247", preprocessed)]);
        return output.First(v => v.Name == "Pooling395_Output_0").AsTensor<float>().ToArray();
    }

    /// <summary>Embeds every image, spreading the work over <paramref name="threads"/> embedders.</summary>
    public static float[][] EmbedAll(IReadOnlyList<byte[]> images, int threads)
    {
        var result = new float[images.Count][];
        Parallel.For(
            0,
            threads,
            new ParallelOptions { MaxDegreeOfParallelism = threads },
            worker =>
            {
                using var embedder = new ReferenceEmbedder();
                for (int i = worker; i < images.Count; i += threads)
                {
                    result[i] = embedder.Embed(images[i]);
                }
            });
        return result;
    }

    public void Dispose()
    {
        _preprocess.Dispose();
        _network.Dispose();
    }

    /// <summary>Bilinear 8× upscale with pixel centres aligned; the grey value goes to R, G and B alike.</summary>
    private static void Upscale(byte[] grey, float[] planes)
    {
        const float scale = (float)FashionMnist.Side / Size;
        for (int y = 0; y < Size; y++)
        {
            float sy = Math.Clamp(((y + 0.5f) * scale) - 0.5f, 0f, FashionMnist.Side - 1);
            int y0 = (int)sy;
            int y1 = Math.Min(y0 + 1, FashionMnist.Side - 1);
            float fy = sy - y0;
            for (int x = 0; x < Size; x++)
            {
                float sx = Math.Clamp(((x + 0.5f) * scale) - 0.5f, 0f, FashionMnist.Side - 1);
                int x0 = (int)sx;
                int x1 = Math.Min(x0 + 1, FashionMnist.Side - 1);
                float fx = sx - x0;
                float top = (grey[(y0 * FashionMnist.Side) + x0] * (1 - fx)) + (grey[(y0 * FashionMnist.Side) + x1] * fx);
                float bottom = (grey[(y1 * FashionMnist.Side) + x0] * (1 - fx)) + (grey[(y1 * FashionMnist.Side) + x1] * fx);
                float v = (top * (1 - fy)) + (bottom * fy);
                int p = (y * Size) + x;
                planes[p] = v;
                planes[(Size * Size) + p] = v;
                planes[(2 * Size * Size) + p] = v;
            }
        }
    }
}

using Microsoft.ML.OnnxRuntime;

namespace Lookup.Embedding;

/// <summary>
/// One caller's input and output buffers, pinned and bound to ONNX Runtime values once, then reused for every
/// inference: no per-photo arrays. Leases are pooled by <see cref="ImageEmbedder"/>, so each concurrent worker
/// ends up holding its own.
/// </summary>
internal sealed class InferenceLease : IDisposable
{
    public InferenceLease(long[] inputShape, long[] outputShape, int inputLength, int outputLength)
    {
        Input = new float[inputLength];
        Output = new float[outputLength];
        Inputs = [OrtValue.CreateTensorValueFromMemory(Input, inputShape)];
        Outputs = [OrtValue.CreateTensorValueFromMemory(Output, outputShape)];
    }

    public float[] Input { get; }

    public float[] Output { get; }

    public OrtValue[] Inputs { get; }

    public OrtValue[] Outputs { get; }

    public RunOptions RunOptions { get; } = new();

    public void Dispose()
    {
        Inputs[0].Dispose();
        Outputs[0].Dispose();
        RunOptions.Dispose();
    }
}

using Microsoft.ML.OnnxRuntime;

namespace Lookup.Embedding;

/// <summary>Opens ONNX Runtime sessions with Lookup's settings and turns runtime errors into <see cref="ModelLoadException"/>.</summary>
internal static class OnnxSessions
{
    /// <summary>
    /// Settings are explicit rather than ONNX Runtime's defaults: ingest runs one worker per core, so each inference
    /// gets <paramref name="intraOpThreads"/> threads (1 by default), no spinning threads burning the other cores
    /// between photos, one inter-op thread and sequential execution.
    /// </summary>
    public static SessionOptions CreateOptions(int intraOpThreads)
    {
        var options = new SessionOptions
        {
            IntraOpNumThreads = intraOpThreads,
            InterOpNumThreads = 1,
            ExecutionMode = ExecutionMode.ORT_SEQUENTIAL,
            GraphOptimizationLevel = GraphOptimizationLevel.ORT_ENABLE_ALL,
        };
        options.AddSessionConfigEntry("session.intra_op.allow_spinning", "0");
        options.AddSessionConfigEntry("session.inter_op.allow_spinning", "0");
        return options;
    }

    public static InferenceSession Open(string path, SessionOptions options)
    {
        try
        {
            return new InferenceSession(path, options);
        }
        catch (OnnxRuntimeException e)
        {
            throw new ModelLoadException($"{path}: ONNX Runtime could not load this model ({e.Message}). Check that the file is a complete ONNX model.", e);
        }
    }

    public static void RequireName(IEnumerable<string> available, string wanted, string path, string kind)
    {
        if (!available.Contains(wanted, StringComparer.Ordinal))
        {
            throw new ModelLoadException($"{path}: the model has no {kind} named '{wanted}'; its {kind}s are: {string.Join(", ", available)}. Fix the {kind} name in the model card.");
        }
    }
}

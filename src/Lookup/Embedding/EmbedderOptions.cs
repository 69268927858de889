namespace Lookup.Embedding;

/// <summary>Runtime settings for an <see cref="ImageEmbedder"/>.</summary>
public sealed record EmbedderOptions
{
    /// <summary>One thread per inference: ingest runs one worker per core instead.</summary>
    public static EmbedderOptions Default { get; } = new();

    /// <summary>Threads ONNX Runtime may use inside one inference (intra-op). Default 1.</summary>
    public int IntraOpThreads { get; init; } = 1;

    internal void Validate() => ArgumentOutOfRangeException.ThrowIfNegativeOrZero(IntraOpThreads);
}

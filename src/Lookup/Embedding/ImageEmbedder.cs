using System.Collections.Concurrent;
using System.Numerics.Tensors;
using Lookup.Imaging;
using Microsoft.ML.OnnxRuntime;
using Microsoft.ML.OnnxRuntime.Tensors;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.Embedding;

/// <summary>
/// Runs an ONNX image network and returns L2-normalised feature vectors, so cosine distance is 1 − dot product.
/// Thread-safe: one instance (one ONNX Runtime session, whose Run is thread-safe) serves every worker; each call
/// borrows pinned buffers from a pool, so concurrent callers never share buffers and steady state allocates
/// nothing per photo. Do not dispose while calls are in flight.
/// </summary>
public sealed class ImageEmbedder : IDisposable
{
    private readonly InferenceSession session;
    private readonly SessionOptions sessionOptions;
    private readonly ConcurrentBag<InferenceLease> leases = [];
    private readonly string[] inputNames;
    private readonly string[] outputNames;
    private readonly long[] inputShape;
    private readonly long[] outputShape;
    private int disposed;

    private ImageEmbedder(ModelCard card, InferenceSession session, SessionOptions sessionOptions, PixelNormalisation normalisation, long[] outputShape, string fingerprint)
    {
        Card = card;
        this.session = session;
        this.sessionOptions = sessionOptions;
        Normalisation = normalisation;
        this.outputShape = outputShape;
        Fingerprint = fingerprint;
        inputNames = [card.InputName];
        outputNames = [card.OutputName];
        inputShape = [1, 3, card.InputSize, card.InputSize];
        Dimension = (int)outputShape.Aggregate(1L, (a, b) => a * b);
    }

    /// <summary>The card this embedder was loaded from.</summary>
    public ModelCard Card { get; }

    /// <summary>Length of every embedding (512 for the default ResNet18).</summary>
    public int Dimension { get; }

    /// <summary>Side of the square network input in pixels.</summary>
    public int InputSize => Card.InputSize;

    /// <summary>Floats in one input tensor: 3 × InputSize × InputSize.</summary>
    public int TensorLength => Normalisation.TensorLength;

    /// <summary>How pixels become input values, with any mean image folded in.</summary>
    public PixelNormalisation Normalisation { get; }

    /// <summary>Hex SHA-256 over the ONNX file(s) and the preprocessing; equal fingerprints mean comparable embeddings.</summary>
    public string Fingerprint { get; }

    /// <summary>Loads the network described by <paramref name="card"/>.</summary>
    /// <exception cref="ModelLoadException">A file is missing or the model does not match the card.</exception>
    public static ImageEmbedder Load(ModelCard card, EmbedderOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(card);
        options ??= EmbedderOptions.Default;
        options.Validate();
        card.Validate($"model card '{card.Name}'");
        if (!File.Exists(card.OnnxFile))
        {
            throw new ModelLoadException($"{card.OnnxFile}: the model file named by card '{card.Name}' does not exist. The default model is copied next to the program under DnnImageModels/ by the build: rebuild or reinstall Lookup, or fix onnxFile in the card.");
        }

        var sessionOptions = OnnxSessions.CreateOptions(options.IntraOpThreads);
        InferenceSession? session = null;
        try
        {
            session = OnnxSessions.Open(card.OnnxFile, sessionOptions);
            CheckInput(card, session);
            var outputShape = OutputShape(card, session);
            var meanImage = card.MeanImageModel is null ? null : MeanImageFolding.ReadMeanImage(card, sessionOptions);
            var normalisation = new PixelNormalisation(card.InputSize, card.ChannelOrder, card.Scale, card.Mean, card.Std, meanImage);
            return new ImageEmbedder(card, session, sessionOptions, normalisation, outputShape, ModelFingerprint.Compute(card));
        }
        catch
        {
            session?.Dispose();
            sessionOptions.Dispose();
            throw;
        }
    }

    /// <summary>
    /// Embeds one prepared tensor (as written by <see cref="TensorWriter"/> with <see cref="Normalisation"/>) into
    /// <paramref name="embedding"/> (exactly <see cref="Dimension"/> floats), normalised to unit length.
    /// </summary>
    /// <returns>The L2 norm before normalisation; 0 means the network gave all zeros and the embedding is zero.</returns>
    public float Embed(ReadOnlySpan<float> tensor, Span<float> embedding)
    {
        if (tensor.Length != TensorLength)
        {
            throw new ArgumentException($"The tensor has {tensor.Length} floats; this model needs {TensorLength} (3 × {InputSize} × {InputSize}).", nameof(tensor));
        }

        CheckEmbeddingLength(embedding);
        var lease = Rent();
        try
        {
            tensor.CopyTo(lease.Input);
            return Infer(lease, embedding);
        }
        finally
        {
            Return(lease);
        }
    }

    /// <summary>Embeds the whole of <paramref name="image"/> (shorter side resized, centre square).</summary>
    public float Embed(Image<Rgb24> image, Span<float> embedding)
    {
        ArgumentNullException.ThrowIfNull(image);
        return Embed(image, new Rectangle(0, 0, image.Width, image.Height), embedding);
    }

    /// <summary>Embeds <paramref name="region"/> of <paramref name="image"/>, for matching crops of one photo.</summary>
    public float Embed(Image<Rgb24> image, Rectangle region, Span<float> embedding)
    {
        ArgumentNullException.ThrowIfNull(image);
        CheckEmbeddingLength(embedding);
        var lease = Rent();
        try
        {
            TensorWriter.WriteTensor(image, region, Normalisation, lease.Input);
            return Infer(lease, embedding);
        }
        finally
        {
            Return(lease);
        }
    }

    /// <inheritdoc/>
    public void Dispose()
    {
        if (Interlocked.Exchange(ref disposed, 1) != 0)
        {
            return;
        }

        while (leases.TryTake(out var lease))
        {
            lease.Dispose();
        }

        session.Dispose();
        sessionOptions.Dispose();
    }

    private float Infer(InferenceLease lease, Span<float> embedding)
    {
        session.Run(lease.RunOptions, inputNames, lease.Inputs, outputNames, lease.Outputs);
        var norm = TensorPrimitives.Norm(lease.Output);
        if (norm > 0 && float.IsFinite(norm))
        {
            TensorPrimitives.Divide(lease.Output, norm, embedding);
        }
        else
        {
            embedding.Clear();
        }

        return norm;
    }

    private InferenceLease Rent()
    {
        ObjectDisposedException.ThrowIf(Volatile.Read(ref disposed) != 0, this);
        return leases.TryTake(out var lease) ? lease : new InferenceLease(inputShape, outputShape, TensorLength, Dimension);
    }

    private void Return(InferenceLease lease)
    {
        if (Volatile.Read(ref disposed) != 0)
        {
            lease.Dispose();
            return;
        }

        leases.Add(lease);
    }

    private void CheckEmbeddingLength(Span<float> embedding)
    {
        if (embedding.Length != Dimension)
        {
            throw new ArgumentException($"The embedding buffer has {embedding.Length} floats; this model produces {Dimension}.", nameof(embedding));
        }
    }

    private static void CheckInput(ModelCard card, InferenceSession session)
    {
        OnnxSessions.RequireName(session.InputMetadata.Keys, card.InputName, card.OnnxFile, "input");
        var input = session.InputMetadata[card.InputName];
        var dims = input.Dimensions;
        var fits = input.ElementDataType == TensorElementType.Float && dims.Length == 4
            && dims[0] is 1 or -1 && dims[1] is 3 or -1
            && (dims[2] == card.InputSize || dims[2] == -1) && (dims[3] == card.InputSize || dims[3] == -1);
        if (!fits)
        {
            throw new ModelLoadException($"{card.OnnxFile}: input '{card.InputName}' is {input.ElementDataType}[{string.Join(", ", dims)}]; the card describes float[1, 3, {card.InputSize}, {card.InputSize}]. Fix inputSize in the card or use another model.");
        }
    }

    private static long[] OutputShape(ModelCard card, InferenceSession session)
    {
        OnnxSessions.RequireName(session.OutputMetadata.Keys, card.OutputName, card.OnnxFile, "output");
        var output = session.OutputMetadata[card.OutputName];
        var dims = output.Dimensions.Select((d, i) => i == 0 && d == -1 ? 1L : d).ToArray();
        if (output.ElementDataType != TensorElementType.Float || dims.Length == 0 || dims.Any(d => d <= 0))
        {
            throw new ModelLoadException($"{card.OnnxFile}: output '{card.OutputName}' is {output.ElementDataType}[{string.Join(", ", output.Dimensions)}]; a fixed-size float feature vector is needed. Name the pooled feature output in the card.");
        }

        return dims;
    }
}

using System.Text.Json;
using System.Text.Json.Serialization;
using Lookup.Imaging;

namespace Lookup.Embedding;

/// <summary>
/// Describes an ONNX image network well enough to embed photos with it: the file, the input and output names, the
/// input size and how pixels are normalised. The default ResNet18 card is built in (<see cref="Default"/>); any
/// other CNN whose output is a feature vector can be brought with a JSON card (<see cref="Load"/>).
/// Paths in a card file are relative to the card; loaded cards hold absolute paths. Record equality compares
/// <see cref="Mean"/> and <see cref="Std"/> by reference: compare <see cref="ImageEmbedder.Fingerprint"/> values to
/// decide whether two cards give comparable embeddings.
/// </summary>
public sealed record ModelCard
{
    /// <summary>Name of the built-in card.</summary>
    public const string DefaultName = "resnet18";

    private static readonly JsonSerializerOptions JsonOptions = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        WriteIndented = true,
        AllowTrailingCommas = true,
        ReadCommentHandling = JsonCommentHandling.Skip,
        UnmappedMemberHandling = JsonUnmappedMemberHandling.Disallow,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.SnakeCaseUpper) },
    };

    /// <summary>Short name shown to users and stored in the index.</summary>
    public required string Name { get; init; }

    /// <summary>Path of the network's ONNX file.</summary>
    public required string OnnxFile { get; init; }

    /// <summary>Name of the input taking float[1, 3, size, size].</summary>
    public required string InputName { get; init; }

    /// <summary>Name of the output holding the feature vector (any shape whose size is the dimension).</summary>
    public required string OutputName { get; init; }

    /// <summary>Side of the square input in pixels.</summary>
    public int InputSize { get; init; } = 224;

    /// <summary>Plane order the network expects.</summary>
    public ChannelOrder ChannelOrder { get; init; } = ChannelOrder.Rgb;

    /// <summary>Multiplier for 0–255 pixel values (1/255 for networks trained on 0–1 input).</summary>
    public float Scale { get; init; } = 1f;

    /// <summary>Per-plane mean subtracted after scaling, in the network's channel order.</summary>
    public IReadOnlyList<float> Mean { get; init; } = [0f, 0f, 0f];

    /// <summary>Per-plane standard deviation divided by after the mean, in the network's channel order.</summary>
    public IReadOnlyList<float> Std { get; init; } = [1f, 1f, 1f];

    /// <summary>Optional model that subtracts a per-pixel mean image; folded into the tensor code at load.</summary>
    public MeanImageModel? MeanImageModel { get; init; }

    /// <summary>The built-in ResNet18 card, using the model files copied next to the running program.</summary>
    public static ModelCard Default => DefaultIn(AppContext.BaseDirectory);

    /// <summary>
    /// The built-in ResNet18 card with its files under <paramref name="directory"/>/DnnImageModels (layout of the
    /// Microsoft.ML.DnnImageFeaturizer.ResNet18 package). Its preprocessing model reorders RGB to BGR and subtracts
    /// a per-pixel mean image; the network's output is the 512-wide global average pool after the last stage.
    /// </summary>
    public static ModelCard DefaultIn(string directory)
    {
        ArgumentException.ThrowIfNullOrEmpty(directory);
        var models = Path.Combine(Path.GetFullPath(directory), "DnnImageModels");
        return new ModelCard
        {
            Name = DefaultName,
            OnnxFile = Path.Combine(models, "ResNet18Onnx", "ResNet18.onnx"),
            InputName = "Input247",
            OutputName = "Pooling395_Output_0",
            InputSize = 224,
            ChannelOrder = ChannelOrder.Bgr,
            MeanImageModel = new MeanImageModel(
                Path.Combine(models, "ResNetPrepOnnx", "ResNetPreprocess.onnx"), "OriginalInput", "PreprocessedInput"),
        };
    }

    /// <summary>Reads a JSON card; relative paths are resolved against the card's folder.</summary>
    /// <exception cref="ModelLoadException">The file is missing, not JSON, or describes an unusable model.</exception>
    public static ModelCard Load(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        string json;
        try
        {
            json = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new ModelLoadException($"{path}: the model card could not be read ({e.Message}). Check the path given for the model card.", e);
        }

        var directory = Path.GetDirectoryName(Path.GetFullPath(path)) ?? Directory.GetCurrentDirectory();
        return FromJson(json, directory, path);
    }

    /// <summary>Parses a JSON card; relative paths are resolved against <paramref name="baseDirectory"/>.</summary>
    /// <exception cref="ModelLoadException">The JSON is malformed or describes an unusable model.</exception>
    public static ModelCard FromJson(string json, string baseDirectory, string source = "model card")
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentException.ThrowIfNullOrEmpty(baseDirectory);
        ModelCard? card;
        try
        {
            card = JsonSerializer.Deserialize<ModelCard>(json, JsonOptions);
        }
        catch (JsonException e)
        {
            throw new ModelLoadException($"{source}: not a valid model card ({e.Message}). See DEVELOPERS.md for the card fields.", e);
        }

        if (card is null)
        {
            throw new ModelLoadException($"{source}: the model card is empty (null). See DEVELOPERS.md for the card fields.");
        }

        card = card.WithPathsUnder(baseDirectory);
        card.Validate(source);
        return card;
    }

    /// <summary>Writes the card as JSON, with paths relative to the card's folder.</summary>
    public void Save(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        var directory = Path.GetDirectoryName(Path.GetFullPath(path)) ?? Directory.GetCurrentDirectory();
        File.WriteAllText(path, ToJson(directory));
    }

    /// <summary>The card as JSON; paths are made relative to <paramref name="baseDirectory"/> when one is given.</summary>
    public string ToJson(string? baseDirectory = null)
    {
        var card = baseDirectory is null ? this : WithPathsRelativeTo(baseDirectory);
        return JsonSerializer.Serialize(card, JsonOptions);
    }

    internal void Validate(string source)
    {
        string? problem = null;
        if (string.IsNullOrWhiteSpace(Name) || string.IsNullOrWhiteSpace(OnnxFile) || string.IsNullOrWhiteSpace(InputName) || string.IsNullOrWhiteSpace(OutputName))
        {
            problem = "name, onnxFile, inputName and outputName must all be given";
        }
        else if (InputSize is < 16 or > 4096)
        {
            problem = $"inputSize {InputSize} is outside 16–4096";
        }
        else if (Mean is not { Count: 3 } || Std is not { Count: 3 })
        {
            problem = $"mean and std need 3 values each (got {Mean?.Count ?? 0} and {Std?.Count ?? 0})";
        }
        else if (!float.IsFinite(Scale) || Scale == 0 || Std.Any(s => !float.IsFinite(s) || s == 0) || Mean.Any(m => !float.IsFinite(m)))
        {
            problem = "scale and every std value must be finite and non-zero, and every mean value finite";
        }

        if (problem is not null)
        {
            throw new ModelLoadException($"{source}: {problem}. Fix the model card and try again.");
        }
    }

    private ModelCard WithPathsUnder(string baseDirectory) => this with
    {
        OnnxFile = Path.GetFullPath(OnnxFile ?? string.Empty, baseDirectory),
        MeanImageModel = MeanImageModel is null ? null : MeanImageModel with { OnnxFile = Path.GetFullPath(MeanImageModel.OnnxFile, baseDirectory) },
    };

    private ModelCard WithPathsRelativeTo(string baseDirectory) => this with
    {
        OnnxFile = Path.GetRelativePath(baseDirectory, OnnxFile),
        MeanImageModel = MeanImageModel is null ? null : MeanImageModel with { OnnxFile = Path.GetRelativePath(baseDirectory, MeanImageModel.OnnxFile) },
    };
}

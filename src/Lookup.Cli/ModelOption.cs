using System.CommandLine;
using Lookup.Embedding;

namespace Lookup.Cli;

/// <summary>The <c>--model</c> option shared by the commands that embed photos, and loading what it names.</summary>
internal static class ModelOption
{
    public static Option<string?> Create() =>
        new("--model") { Description = "A model card (JSON) for another ONNX network; default: the built-in ResNet18." };

    /// <summary>Loads the card (or the default) and its network; on failure writes the reason and returns null.</summary>
    public static ImageEmbedder? TryLoad(string? cardPath, string command, TextWriter error, int threads = 1)
    {
        try
        {
            var card = cardPath is null ? ModelCard.Default : ModelCard.Load(cardPath);
            return ImageEmbedder.Load(card, new EmbedderOptions { IntraOpThreads = threads });
        }
        catch (ModelLoadException e)
        {
            error.WriteLine($"lookup {command}: {e.Message}");
            return null;
        }
    }
}

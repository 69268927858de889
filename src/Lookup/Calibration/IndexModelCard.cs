using System.Text.Json;
using Lookup.Embedding;
using Lookup.Store;

namespace Lookup.Calibration;

/// <summary>The model card an index was built with, as stored by ingest.</summary>
public static class IndexModelCard
{
    /// <summary>
    /// The card to embed with for <paramref name="settings"/>: the file at <paramref name="cardPath"/> when given,
    /// else the stored card; when the stored card is the built-in one and its files are not where that build kept
    /// them (another install), the built-in card of this program. A different model still shows as a different
    /// fingerprint, which callers compare.
    /// </summary>
    /// <exception cref="ModelLoadException">The card cannot be read.</exception>
    public static ModelCard Resolve(CatalogueSettings settings, string? cardPath)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (cardPath is not null)
        {
            return ModelCard.Load(cardPath);
        }

        var stored = ModelCard.FromJson(settings.ModelCardJson, AppContext.BaseDirectory, "the model card stored in the index");
        return stored.Name == ModelCard.DefaultName && !File.Exists(stored.OnnxFile) ? ModelCard.Default : stored;
    }

    /// <summary>The name in a stored card's JSON, or "unknown" when it cannot be read.</summary>
    public static string Name(string cardJson)
    {
        try
        {
            using var card = JsonDocument.Parse(cardJson);
            return card.RootElement.TryGetProperty("name", out var name) && name.ValueKind == JsonValueKind.String
                ? name.GetString() ?? "unknown"
                : "unknown";
        }
        catch (JsonException)
        {
            return "unknown";
        }
    }

    /// <summary>The first 12 hex digits of a fingerprint, for messages.</summary>
    public static string Short(string? fingerprint) =>
        fingerprint is null ? "none" : fingerprint.Length <= 12 ? fingerprint : fingerprint[..12] + "…";
}

using System.Text.Json;

namespace Lookup.Demo;

/// <summary>
/// What the demo catalogue really holds (<c>truth.json</c>, written by tools/DemoGenerator): the SKU each field photo
/// shows and the mistakes planted in the catalogue photos.
/// </summary>
internal sealed record DemoTruth(IReadOnlyList<DemoFieldPhoto> Field, IReadOnlyList<DemoDefect> Defects)
{
    /// <summary>The truth file's name inside the demo folder.</summary>
    public const string FileName = "truth.json";

    /// <summary>The folder of catalogue photos inside the demo folder, one sub-folder per SKU.</summary>
    public const string PhotosFolder = "photos";

    /// <summary>Reads <c>truth.json</c> from <paramref name="demoFolder"/>.</summary>
    /// <exception cref="DemoTruthException">Missing, not JSON, or without the field and defect lists.</exception>
    public static DemoTruth Load(string demoFolder)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(demoFolder);
        var path = Path.Combine(demoFolder, FileName);
        if (!File.Exists(path))
        {
            throw new DemoTruthException($"{path} does not exist: give the demo-catalogue folder of the repository (it holds {FileName}, catalogue.csv and photos/).");
        }

        try
        {
            using var document = JsonDocument.Parse(File.ReadAllText(path));
            var root = document.RootElement;
            var field = root.GetProperty("field").EnumerateArray()
                .Select(f => new DemoFieldPhoto(
                    Text(f, "file"),
                    f.GetProperty("sku").ValueKind == JsonValueKind.Null ? null : Text(f, "sku"),
                    f.TryGetProperty("description", out var d) ? d.GetString() ?? "" : ""))
                .ToList();
            var defects = root.GetProperty("defects").EnumerateArray()
                .Select(d => new DemoDefect(
                    Text(d, "kind"),
                    Texts(d, "files"),
                    Texts(d, "filedUnder"),
                    Texts(d, "actualSku"),
                    d.TryGetProperty("note", out var n) ? n.GetString() ?? "" : ""))
                .ToList();
            return new DemoTruth(field, defects);
        }
        catch (Exception e) when (e is JsonException or KeyNotFoundException or InvalidOperationException)
        {
            throw new DemoTruthException(
                $"{path} could not be read ({e.Message}): restore it with git checkout, or regenerate the demo folder (see its README.md).", e);
        }
    }

    private static string Text(JsonElement element, string name) =>
        element.GetProperty(name).GetString() ?? throw new InvalidOperationException($"'{name}' is null");

    private static List<string> Texts(JsonElement element, string name) =>
        [.. element.GetProperty(name).EnumerateArray().Select(e => e.GetString() ?? throw new InvalidOperationException($"'{name}' holds a null"))];
}

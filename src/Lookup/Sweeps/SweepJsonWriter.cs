using System.Text.Json;
using System.Text.Json.Serialization;

namespace Lookup.Sweeps;

/// <summary>The report as JSON for scripts (System.Text.Json): camelCase names, enums as strings, indented.</summary>
public static class SweepJsonWriter
{
    /// <summary>The serializer settings used, for readers that want to load a report back.</summary>
    public static JsonSerializerOptions Options { get; } = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = true,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase) },
        NumberHandling = JsonNumberHandling.Strict,
    };

    /// <summary>Writes the report as UTF-8 JSON.</summary>
    public static void Write(SweepReport report, Stream stream)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(stream);
        JsonSerializer.Serialize(stream, report, Options);
    }

    /// <summary>The report as a JSON string.</summary>
    public static string ToJson(SweepReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return JsonSerializer.Serialize(report, Options);
    }
}

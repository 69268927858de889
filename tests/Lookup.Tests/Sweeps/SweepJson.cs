using System.Text.Json;

namespace Lookup.Tests.Sweeps;

/// <summary>The parts of <c>lookup sweep --json</c> output the command tests look at.</summary>
internal sealed record SweepJson(
    int? Sweep,
    bool Stored,
    int? PreviousSweep,
    IReadOnlyList<string> NewFindingKeys,
    IReadOnlyList<SweepJson.Finding> Findings)
{
    public static SweepJson Parse(string json)
    {
        using var document = JsonDocument.Parse(json);
        var root = document.RootElement;
        return new SweepJson(
            root.GetProperty("sweep").ValueKind == JsonValueKind.Null ? null : root.GetProperty("sweep").GetInt32(),
            root.GetProperty("stored").GetBoolean(),
            root.GetProperty("previousSweep").ValueKind == JsonValueKind.Null ? null : root.GetProperty("previousSweep").GetInt32(),
            [.. root.GetProperty("newFindingKeys").EnumerateArray().Select(k => k.GetString()!)],
            [.. root.GetProperty("report").GetProperty("findings").EnumerateArray().Select(ReadFinding)]);
    }

    private static Finding ReadFinding(JsonElement f)
    {
        var pathOf = f.GetProperty("members").EnumerateArray()
            .GroupBy(m => m.GetProperty("photoId").GetInt32())
            .ToDictionary(g => g.Key, g => g.First().GetProperty("path").GetString()!);
        return new Finding(
            f.GetProperty("kind").GetString()!,
            f.GetProperty("key").GetString()!,
            [.. f.GetProperty("members").EnumerateArray().Select(m => (m.GetProperty("sku").GetString()!, m.GetProperty("path").GetString()!))],
            [.. f.GetProperty("pairs").EnumerateArray().Select(p => new Pair(
                pathOf[p.GetProperty("firstPhotoId").GetInt32()],
                pathOf[p.GetProperty("secondPhotoId").GetInt32()],
                p.GetProperty("relation").GetString()!,
                p.GetProperty("evidence").GetProperty("edits").GetString()!,
                p.GetProperty("evidence").GetProperty("distance").GetSingle(),
                p.GetProperty("key").GetString()!))]);
    }

    /// <summary>A finding: kind as JSON writes it (camelCase), key, members (SKU, path), pairs.</summary>
    public sealed record Finding(string Kind, string Key, IReadOnlyList<(string Sku, string Path)> Members, IReadOnlyList<Pair> Pairs)
    {
        public IEnumerable<string> Paths => Members.Select(m => m.Path);
    }

    /// <summary>A pair by paths, with relation and edits as JSON writes them ("identicalBytes", "cropped, resized").</summary>
    public sealed record Pair(string First, string Second, string Relation, string Edits, float Distance, string Key)
    {
        public bool Joins(string a, string b) => (First == a && Second == b) || (First == b && Second == a);
    }
}

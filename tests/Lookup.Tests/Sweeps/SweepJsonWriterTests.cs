using System.Text.Json;
using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class SweepJsonWriterTests
{
    [Fact]
    public void Write_gives_json_that_a_plain_parser_reads_back_with_names_kinds_and_paths_intact()
    {
        var report = HostileCatalogue.Report();
        using var stream = new MemoryStream();

        SweepJsonWriter.Write(report, stream);

        using var json = JsonDocument.Parse(stream.ToArray());
        var root = json.RootElement;
        var findings = root.GetProperty("findings");
        Assert.Equal(report.Findings.Count, findings.GetArrayLength());
        Assert.Equal("samePhotoSeveralSkus", findings[0].GetProperty("kind").GetString());
        Assert.Contains(
            findings.EnumerateArray().SelectMany(f => f.GetProperty("members").EnumerateArray()),
            m => m.GetProperty("sku").GetString() == HostileCatalogue.Skus["F"]);
        Assert.Equal(report.Counts.PairsExamined, root.GetProperty("counts").GetProperty("pairsExamined").GetInt64());
        Assert.Equal(Verdicts.SafetyNotice, root.GetProperty("notice").GetString());
        Assert.Equal(0.25, root.GetProperty("settings").GetProperty("copyMaxDistance").GetDouble(), 1e-6);
    }

    [Fact]
    public void Write_leaves_the_correlation_null_where_no_thumbnails_were_compared()
    {
        var report = HostileCatalogue.Report();

        using var json = JsonDocument.Parse(SweepJsonWriter.ToJson(report));

        var identical = json.RootElement.GetProperty("findings")[0].GetProperty("pairs").EnumerateArray()
            .Single(p => p.GetProperty("relation").GetString() == "identicalBytes");
        Assert.Equal(JsonValueKind.Null, identical.GetProperty("evidence").GetProperty("correlation").ValueKind);
    }
}

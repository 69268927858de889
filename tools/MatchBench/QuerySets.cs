using System.Text.Json;
using Lookup.Tests.Imaging;
using Lookup.Tests.Matching;

namespace MatchBench;

/// <summary>Writes the measured query sets: the demo's field photos, and reference photos filed, edited, held out and
/// pasted onto bench backgrounds.</summary>
internal static class QuerySets
{
    public const string DemoField = "demo field photos";
    public const string RefPartners = "ref: pair partners (whole)";
    public const string RefEdits = "ref: Copydays edits (whole)";
    public const string RefHeldOut = "ref: held out (whole)";
    public const string SnapFiled = "ref snapshots: filed photo";
    public const string SnapPartner = "ref snapshots: pair partner";
    public const string SnapHeldOut = "ref snapshots: held out";

    public static List<Query> Demo(string demoRoot)
    {
        using var truth = JsonDocument.Parse(File.ReadAllText(Path.Combine(demoRoot, "truth.json")));
        return [.. truth.RootElement.GetProperty("field").EnumerateArray().Select(f => new Query(
            Path.Combine(demoRoot, f.GetProperty("file").GetString()!),
            f.GetProperty("sku").ValueKind == JsonValueKind.Null ? null : f.GetProperty("sku").GetString(),
            DemoField,
            null))];
    }

    /// <summary>Writes work/catalogue (to ingest) and work/queries; returns the queries.</summary>
    public static List<Query> Reference(string work, int snapshotsPerPhoto)
    {
        var catalogue = Path.Combine(work, "catalogue");
        var queries = Path.Combine(work, "queries");
        Directory.CreateDirectory(queries);
        var (others, heldOut) = ReferenceCatalogue.Others();
        var filed = ReferenceCatalogue.OpenCv(ReferenceCatalogue.Pairs.Select(p => p.Filed).Concat(others))
            .Concat(ReferenceCatalogue.SkImageOriginals.Select(ReferenceData.SkImage))
            .ToList();
        ReferenceCatalogue.Write(catalogue, filed);

        var list = new List<Query>();
        foreach (var (filedName, partner) in ReferenceCatalogue.Pairs)
        {
            list.Add(new Query(ReferenceData.OpenCv(partner), ReferenceCatalogue.SkuOf(filedName), RefPartners, null));
        }

        foreach (var original in ReferenceCatalogue.SkImageOriginals)
        {
            foreach (var edit in CopydaysEdits.Names)
            {
                var file = Path.Combine(queries, $"{ReferenceCatalogue.SkuOf(original)}.{edit}.{(edit.StartsWith("jpeg", StringComparison.Ordinal) ? "jpg" : "png")}");
                File.WriteAllBytes(file, CopydaysEdits.Apply(ReferenceData.SkImage(original), edit));
                list.Add(new Query(file, ReferenceCatalogue.SkuOf(original), RefEdits, null));
            }
        }

        list.AddRange(heldOut.Select(n => new Query(ReferenceData.OpenCv(n), null, RefHeldOut, null)));

        int seed = 1;
        foreach (var source in filed)
        {
            list.AddRange(Snapshots(queries, source, ReferenceCatalogue.SkuOf(Path.GetFileName(source)), SnapFiled, snapshotsPerPhoto, ref seed));
        }

        foreach (var (filedName, partner) in ReferenceCatalogue.Pairs)
        {
            list.AddRange(Snapshots(queries, ReferenceData.OpenCv(partner), ReferenceCatalogue.SkuOf(filedName), SnapPartner, snapshotsPerPhoto, ref seed));
        }

        foreach (var name in heldOut)
        {
            list.AddRange(Snapshots(queries, ReferenceData.OpenCv(name), null, SnapHeldOut, Math.Min(2, snapshotsPerPhoto), ref seed));
        }

        return list;
    }

    private static List<Query> Snapshots(string folder, string source, string? truth, string set, int count, ref int seed)
    {
        var list = new List<Query>();
        string group = $"{set}:{Path.GetFileName(source)}";
        for (int i = 0; i < count; i++, seed++)
        {
            var background = ReferenceData.OpenCv(BenchSnapshot.Backgrounds[i % BenchSnapshot.Backgrounds.Length]);
            var file = Path.Combine(folder, $"snap-{Path.GetFileNameWithoutExtension(source)}-{(truth is null ? "unknown" : "known")}-{i}.jpg");
            File.WriteAllBytes(file, BenchSnapshot.Make(source, background, BenchSnapshot.PlacementFor(seed)));
            list.Add(new Query(file, truth, set, group));
        }

        return list;
    }
}

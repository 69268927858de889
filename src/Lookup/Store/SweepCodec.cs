using LiteDB;
using Lookup.Sweeps;

namespace Lookup.Store;

/// <summary>Stored sweeps and findings to and from BSON documents (short field names: there can be many findings).</summary>
internal static class SweepCodec
{
    public static BsonDocument ToBson(StoredSweep s)
    {
        var byKind = new BsonDocument();
        foreach (var (kind, count) in s.FindingsByKind)
        {
            byKind[kind] = count;
        }

        return new BsonDocument
        {
            ["_id"] = s.Number,
            ["started"] = s.StartedUtc,
            ["finished"] = s.FinishedUtc,
            ["photos"] = s.Photos,
            ["skus"] = s.Skus,
            ["pairs"] = s.PairsExamined,
            ["findings"] = s.Findings,
            ["new"] = s.NewFindings,
            ["byKind"] = byKind,
            ["settings"] = s.SettingsJson,
            ["by"] = s.RunBy,
        };
    }

    public static StoredSweep Sweep(BsonDocument d) => new(
        d["_id"].AsInt32,
        d["started"].AsDateTime.ToUniversalTime(),
        d["finished"].AsDateTime.ToUniversalTime(),
        d["photos"].AsInt32,
        d["skus"].AsInt32,
        d["pairs"].AsInt64,
        d["findings"].AsInt32,
        d["new"].AsInt32,
        d["byKind"].AsDocument.ToDictionary(e => e.Key, e => e.Value.AsInt32, StringComparer.Ordinal),
        d["settings"].AsString,
        d["by"].AsString);

    public static BsonDocument ToBson(StoredFinding f) => new()
    {
        ["sweep"] = f.Sweep,
        ["n"] = f.Order,
        ["kind"] = FindingKindText.Code(f.Kind),
        ["key"] = f.Key,
        ["members"] = new BsonArray(f.Members.Select(m => (BsonValue)new BsonDocument
        {
            ["path"] = m.Path,
            ["sku"] = m.Sku,
            ["sha"] = m.Sha256,
        })),
        ["pairs"] = new BsonArray(f.Pairs.Select(p => (BsonValue)new BsonDocument
        {
            ["key"] = p.Key,
            ["a"] = p.FirstPath,
            ["b"] = p.SecondPath,
            ["d"] = (double)p.Distance,
            ["rel"] = p.Relation,
        })),
    };

    public static StoredFinding Finding(BsonDocument d) => new(
        d["sweep"].AsInt32,
        d["n"].AsInt32,
        KindOf(d["kind"].AsString),
        d["key"].AsString,
        [.. d["members"].AsArray.Select(m => new StoredMember(m["path"].AsString, m["sku"].AsString, m["sha"].AsString))],
        [.. d["pairs"].AsArray.Select(p => new StoredPair(p["key"].AsString, p["a"].AsString, p["b"].AsString, (float)p["d"].AsDouble, p["rel"].AsString))]);

    private static FindingKind KindOf(string code) =>
        Enum.GetValues<FindingKind>().First(k => FindingKindText.Code(k) == code);
}

using LiteDB;

namespace Lookup.Store;

/// <summary>
/// Reviewers' "not a duplicate" decisions (<c>decisions</c>, one document per pair or finding key). The first
/// decision on a key stands: a second one is not recorded and the caller is told who decided first. Never pruned.
/// Thread safety: reads from any thread; <see cref="TryAdd"/> on the writer only.
/// </summary>
public sealed class DecisionStore
{
    internal const string CollectionName = "decisions";

    private readonly IndexFile _file;

    /// <summary>The decisions of <paramref name="file"/>.</summary>
    public DecisionStore(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        _file = file;
    }

    private ILiteCollection<BsonDocument> Decisions => _file.Database.GetCollection(CollectionName);

    /// <summary>Every decision, oldest first.</summary>
    public IReadOnlyList<ReviewerDecision> All() => _file.Database.CollectionExists(CollectionName)
        ? [.. Decisions.FindAll().Select(FromBson).OrderBy(d => d.DecidedUtc).ThenBy(d => d.Key, StringComparer.Ordinal)]
        : [];

    /// <summary>The decision on <paramref name="key"/>, or null.</summary>
    public ReviewerDecision? Find(string key) =>
        _file.Database.CollectionExists(CollectionName) && Decisions.FindById(key) is { } doc ? FromBson(doc) : null;

    /// <summary>
    /// Records <paramref name="decision"/> unless its key already has one (joins the caller's transaction).
    /// </summary>
    /// <returns>Null when recorded; otherwise the decision already standing.</returns>
    public ReviewerDecision? TryAdd(ReviewerDecision decision)
    {
        ArgumentNullException.ThrowIfNull(decision);
        _file.RequireWritable();
        // FindById on the collection itself: it sees this transaction's own inserts, which Find's existence check does not.
        if (Decisions.FindById(decision.Key) is { } standing)
        {
            return FromBson(standing);
        }

        Decisions.Insert(ToBson(decision));
        return null;
    }

    /// <summary>Deletes the decision on <paramref name="key"/> (joins the caller's transaction); false when there was none.</summary>
    public bool Remove(string key)
    {
        ArgumentException.ThrowIfNullOrEmpty(key);
        _file.RequireWritable();
        return _file.Database.CollectionExists(CollectionName) && Decisions.Delete(key);
    }

    /// <summary>Deletes the pair decisions recorded with the finding decision <paramref name="findingKey"/>; returns how many.</summary>
    public int RemoveRecordedWith(string findingKey)
    {
        ArgumentException.ThrowIfNullOrEmpty(findingKey);
        _file.RequireWritable();
        return _file.Database.CollectionExists(CollectionName) ? Decisions.DeleteMany(Query.EQ("via", findingKey)) : 0;
    }

    private static BsonDocument ToBson(ReviewerDecision d) => new()
    {
        ["_id"] = d.Key,
        ["target"] = d.Target == DecisionTarget.Pair ? "pair" : "finding",
        ["verdict"] = "not-duplicate",
        ["who"] = d.Reviewer,
        ["at"] = d.DecidedUtc,
        ["note"] = d.Note,
        ["paths"] = new BsonArray(d.Paths.Select(p => (BsonValue)p)),
        ["via"] = d.ViaFinding is null ? BsonValue.Null : d.ViaFinding,
        ["source"] = d.Source,
    };

    private static ReviewerDecision FromBson(BsonDocument d) => new(
        d["_id"].AsString,
        d["target"].AsString == "pair" ? DecisionTarget.Pair : DecisionTarget.Finding,
        d["who"].AsString,
        d["at"].AsDateTime.ToUniversalTime(),
        d["note"].AsString,
        [.. d["paths"].AsArray.Select(p => p.AsString)],
        d["via"].IsNull ? null : d["via"].AsString,
        d["source"].AsString);
}

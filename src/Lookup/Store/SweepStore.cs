using LiteDB;

namespace Lookup.Store;

/// <summary>
/// The sweeps an index remembers: <c>sweeps</c> holds one summary document per sweep (kept for good),
/// <c>sweep_findings</c> one document per finding with its key, members and pairs, kept for the last
/// <see cref="FindingsKeptForSweeps"/> sweeps (enough to compare with the previous one and to dismiss a recent
/// finding by key; reviewers' decisions live apart and are never pruned).
/// Thread safety: reads from any thread; <see cref="Save"/> on the writer only.
/// </summary>
public sealed class SweepStore
{
    /// <summary>Sweeps whose findings are kept; older sweeps keep their summary only.</summary>
    public const int FindingsKeptForSweeps = 10;

    internal const string SweepCollection = "sweeps";
    internal const string FindingCollection = "sweep_findings";

    private readonly IndexFile _file;

    /// <summary>The sweeps of <paramref name="file"/>.</summary>
    public SweepStore(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        _file = file;
        if (file.IsWritable)
        {
            Findings.EnsureIndex("sweep");
            Findings.EnsureIndex("key");
        }
    }

    private ILiteCollection<BsonDocument> Sweeps => _file.Database.GetCollection(SweepCollection);

    private ILiteCollection<BsonDocument> Findings => _file.Database.GetCollection(FindingCollection);

    /// <summary>The latest stored sweep, or null when the index was never swept.</summary>
    public StoredSweep? Latest() =>
        Exists(SweepCollection) && Sweeps.Find(Query.All("_id", Query.Descending), 0, 1).FirstOrDefault() is { } doc
            ? SweepCodec.Sweep(doc)
            : null;

    /// <summary>The stored sweeps, newest first.</summary>
    public IEnumerable<StoredSweep> History(int max = int.MaxValue) =>
        Exists(SweepCollection) ? Sweeps.Find(Query.All("_id", Query.Descending), 0, max).Select(SweepCodec.Sweep) : [];

    /// <summary>The findings stored for sweep <paramref name="number"/> in report order (empty when pruned).</summary>
    public IReadOnlyList<StoredFinding> FindingsOf(int number) => Exists(FindingCollection)
        ? [.. Findings.Find(Query.EQ("sweep", number)).Select(SweepCodec.Finding).OrderBy(f => f.Order)]
        : [];

    /// <summary>The keys of the findings of sweep <paramref name="number"/>.</summary>
    public IReadOnlySet<string> KeysOf(int number) =>
        FindingsOf(number).Select(f => f.Key).ToHashSet(StringComparer.Ordinal);

    /// <summary>Stored findings whose key starts with <paramref name="keyPrefix"/> (lower-case hex), newest sweep first.</summary>
    public IReadOnlyList<StoredFinding> FindByKeyPrefix(string keyPrefix)
    {
        ArgumentException.ThrowIfNullOrEmpty(keyPrefix);
        return Exists(FindingCollection)
            ? [.. Findings.Find(Query.StartsWith("key", keyPrefix.ToLowerInvariant())).Select(SweepCodec.Finding).OrderByDescending(f => f.Sweep)]
            : [];
    }

    /// <summary>Stored pairs whose key starts with <paramref name="keyPrefix"/>, with the finding holding each, newest sweep first.</summary>
    public IReadOnlyList<(StoredFinding Finding, StoredPair Pair)> FindPairsByKeyPrefix(string keyPrefix)
    {
        ArgumentException.ThrowIfNullOrEmpty(keyPrefix);
        var prefix = keyPrefix.ToLowerInvariant();
        if (!Exists(FindingCollection))
        {
            return [];
        }

        // Pair keys are not indexed: at most FindingsKeptForSweeps sweeps of findings are scanned, and only by dismiss.
        return [.. Findings.FindAll().Select(SweepCodec.Finding)
            .SelectMany(f => f.Pairs.Where(p => p.Key.StartsWith(prefix, StringComparison.Ordinal)).Select(p => (f, p)))
            .OrderByDescending(x => x.f.Sweep)];
    }

    /// <summary>
    /// Stores a sweep as the next number, with its findings, in one transaction (joining the caller's), and drops
    /// the findings of sweeps older than the last <see cref="FindingsKeptForSweeps"/>.
    /// </summary>
    /// <returns>The number given to the sweep.</returns>
    public int Save(StoredSweep sweep, IReadOnlyList<StoredFinding> findings)
    {
        ArgumentNullException.ThrowIfNull(sweep);
        ArgumentNullException.ThrowIfNull(findings);
        _file.RequireWritable();
        var number = 0;
        _file.InTransaction(() =>
        {
            number = (Latest()?.Number ?? 0) + 1;
            Sweeps.Insert(SweepCodec.ToBson(sweep with { Number = number }));
            Findings.InsertBulk(findings.Select(f => SweepCodec.ToBson(f with { Sweep = number })));
            Findings.DeleteMany(Query.LTE("sweep", number - FindingsKeptForSweeps));
        });
        return number;
    }

    private bool Exists(string collection) => _file.Database.CollectionExists(collection);
}

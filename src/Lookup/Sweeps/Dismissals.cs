using System.Globalization;
using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>
/// Records reviewers' "not a duplicate" decisions in an index: by finding key (the finding and all its pairs, as
/// <see cref="ReviewDecisions.DismissFinding"/> does), by pair key, or by two photos' paths. Keys are looked up in the
/// stored sweeps (a unique prefix is enough); paths in the photo records. All requests of one call are recorded in one
/// transaction; a request that cannot be resolved is reported and the others are still recorded.
/// </summary>
public static class Dismissals
{
    /// <summary>The shortest key prefix accepted (8 hex digits: 32 bits, unique among any realistic number of findings).</summary>
    public const int MinKeyPrefix = 8;

    /// <summary>Resolves and records <paramref name="requests"/> in <paramref name="index"/> (open for writing).</summary>
    /// <param name="index">The index, opened with <see cref="IndexAccess.Write"/>.</param>
    /// <param name="requests">What to dismiss.</param>
    /// <param name="reviewer">Who decides, for requests that do not name someone.</param>
    /// <param name="workingDirectory">Resolves photo paths given relative to it (a file under the catalogue root).</param>
    /// <param name="clock">The time recorded; the system clock when null.</param>
    public static IReadOnlyList<DismissOutcome> Apply(
        IndexFile index, IReadOnlyList<DismissRequest> requests, string reviewer, string workingDirectory, TimeProvider? clock = null)
    {
        ArgumentNullException.ThrowIfNull(index);
        ArgumentNullException.ThrowIfNull(requests);
        ArgumentException.ThrowIfNullOrWhiteSpace(reviewer);
        ArgumentNullException.ThrowIfNull(workingDirectory);
        index.RequireWritable();
        var now = (clock ?? TimeProvider.System).GetUtcNow().UtcDateTime;
        var context = new Context(
            new SweepStore(index), new DecisionStore(index), new PhotoTable(index), CatalogueSettings.Read(index)?.CatalogueRoot, workingDirectory);
        var outcomes = new List<DismissOutcome>(requests.Count);
        index.InTransaction(() =>
        {
            foreach (var request in requests)
            {
                outcomes.Add(request.Key is not null
                    ? ByKey(context, request, request.Reviewer ?? reviewer, now)
                    : ByPaths(context, request, request.Reviewer ?? reviewer, now));
            }
        });
        return outcomes;
    }

    private static DismissOutcome ByKey(Context c, DismissRequest request, string reviewer, DateTime now)
    {
        var prefix = request.Key!.Trim().ToLowerInvariant();
        if (prefix.Length < MinKeyPrefix || prefix.Length > 32 || !prefix.All(char.IsAsciiHexDigit))
        {
            return Fail(request, DismissStatus.NotFound,
                $"\"{request.Key}\" is not a key: give the {MinKeyPrefix} to 32 hex digits shown in the key column of a sweep's table, CSV or JSON.");
        }

        var findings = c.Sweeps.FindByKeyPrefix(prefix);
        var findingKeys = findings.Select(f => f.Key).Distinct(StringComparer.Ordinal).ToList();
        if (findingKeys.Count > 1)
        {
            return Fail(request, DismissStatus.Ambiguous,
                $"Key prefix {prefix} fits {findingKeys.Count} findings ({string.Join(", ", findingKeys.Take(3))}{(findingKeys.Count > 3 ? ", …" : "")}): give more digits.");
        }

        if (findingKeys.Count == 1)
        {
            return DismissFinding(c, request, findings[0], reviewer, now);
        }

        var pairs = c.Sweeps.FindPairsByKeyPrefix(prefix);
        var pairKeys = pairs.Select(p => p.Pair.Key).Distinct(StringComparer.Ordinal).ToList();
        if (pairKeys.Count > 1)
        {
            return Fail(request, DismissStatus.Ambiguous, $"Key prefix {prefix} fits {pairKeys.Count} pairs: give more digits.");
        }

        if (pairKeys.Count == 1)
        {
            var pair = pairs[0].Pair;
            return Record(c, request, DecisionTarget.Pair, pair.Key, [pair.FirstPath, pair.SecondPath], reviewer, now);
        }

        return Fail(request, DismissStatus.NotFound,
            $"No finding or pair of the stored sweeps has a key starting with {prefix} (findings are kept for the last " +
            $"{SweepStore.FindingsKeptForSweeps} sweeps): copy the key from the latest sweep's table, CSV or JSON, or dismiss the two photos with --pair.");
    }

    private static DismissOutcome DismissFinding(Context c, DismissRequest request, StoredFinding finding, string reviewer, DateTime now)
    {
        var paths = finding.Members.Select(m => m.Path).Distinct(StringComparer.Ordinal).ToList();
        var pairsRecorded = 0;
        foreach (var pair in finding.Pairs.DistinctBy(p => p.Key))
        {
            var decision = new ReviewerDecision(
                pair.Key, DecisionTarget.Pair, reviewer, now, request.Note, [pair.FirstPath, pair.SecondPath], finding.Key, request.Source);
            pairsRecorded += c.Decisions.TryAdd(decision) is null ? 1 : 0;
        }

        return Record(c, request, DecisionTarget.Finding, finding.Key, paths, reviewer, now, pairsRecorded,
            $"{FindingKindText.Label(finding.Kind)}, {paths.Count} photos");
    }

    private static DismissOutcome ByPaths(Context c, DismissRequest request, string reviewer, DateTime now)
    {
        if (string.IsNullOrWhiteSpace(request.FirstPath) || string.IsNullOrWhiteSpace(request.SecondPath))
        {
            return Fail(request, DismissStatus.NotFound, "A pair needs two photo paths.");
        }

        var first = Photo(c, request.FirstPath);
        var second = Photo(c, request.SecondPath);
        foreach (var (given, found) in new[] { (request.FirstPath, first), (request.SecondPath, second) })
        {
            if (found?.Sha256 is null)
            {
                var root = c.Root is null ? "" : $" (paths are relative to the catalogue root {c.Root})";
                return Fail(request, DismissStatus.NotFound, found is null
                    ? $"{given} is not a photo of this index{root}: give its path as the sweep reported it."
                    : $"{given} is in the index but was never read successfully, so it has no content hash to decide on; fix the file and ingest again.");
            }
        }

        if (string.Equals(first!.Path, second!.Path, StringComparison.Ordinal))
        {
            return Fail(request, DismissStatus.NotFound, $"Both paths name the same photo, {first.Path}: give two different photos.");
        }

        var key = FindingKeys.Pair(first.Sha256!, second.Sha256!);
        return Record(c, request, DecisionTarget.Pair, key, [first.Path, second.Path], reviewer, now);
    }

    private static PhotoRecord? Photo(Context c, string given)
    {
        var asKey = given.Replace('\\', '/');
        while (asKey.StartsWith("./", StringComparison.Ordinal))
        {
            asKey = asKey[2..];
        }

        if (c.Photos.Find(asKey) is { } direct)
        {
            return direct;
        }

        if (c.Root is null)
        {
            return null;
        }

        var full = Path.GetFullPath(Path.Combine(c.WorkingDirectory, given));
        var relative = Path.GetRelativePath(c.Root, full).Replace('\\', '/');
        return relative.StartsWith("../", StringComparison.Ordinal) || relative == ".." || Path.IsPathRooted(relative)
            ? null
            : c.Photos.Find(relative);
    }

    private static DismissOutcome Record(
        Context c, DismissRequest request, DecisionTarget target, string key, IReadOnlyList<string> paths,
        string reviewer, DateTime now, int pairsRecorded = 1, string? what = null)
    {
        var standing = c.Decisions.TryAdd(new ReviewerDecision(key, target, reviewer, now, request.Note, paths, null, request.Source));
        var noun = target == DecisionTarget.Finding ? $"finding {key} ({what})" : $"pair {key} ({string.Join(" + ", paths)})";
        if (standing is not null)
        {
            return new DismissOutcome(request, DismissStatus.AlreadyDismissed, target, key, paths, 0, string.Create(
                CultureInfo.InvariantCulture,
                $"The {noun} was already dismissed by {standing.Reviewer} on {standing.DecidedUtc:yyyy-MM-dd HH:mm} UTC; that decision stands."));
        }

        var pairs = target == DecisionTarget.Finding ? $" with {pairsRecorded} of its pairs" : "";
        return new DismissOutcome(request, DismissStatus.Dismissed, target, key, paths, target == DecisionTarget.Pair ? 1 : pairsRecorded,
            $"Dismissed the {noun}{pairs} as not a duplicate; later sweeps will not report it.");
    }

    private static DismissOutcome Fail(DismissRequest request, DismissStatus status, string message) =>
        new(request, status, null, null, [], 0, message);

    private sealed record Context(SweepStore Sweeps, DecisionStore Decisions, PhotoTable Photos, string? Root, string WorkingDirectory);
}

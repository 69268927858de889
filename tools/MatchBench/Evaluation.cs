using System.Globalization;
using Lookup.Matching;
using Lookup.Store;

namespace MatchBench;

/// <summary>
/// Measures lookup match end to end (the real command, --each --json): top-1/top-5 per crop set and query set, the
/// verdict trade-off over a grid of same-part distances and margins, and mean versus min fusion of several snapshots
/// of one subject. Prints Markdown tables for DEVELOPERS.md.
/// </summary>
internal static class Evaluation
{
    private static readonly float[] SamePartGrid = [0.20f, 0.22f, 0.24f, 0.25f, 0.26f, 0.28f, 0.30f, 0.35f, 0.40f];
    private static readonly float[] MarginGrid = [0f, 0.05f, 0.10f, 0.15f];

    public static int Run(Arguments args)
    {
        var cli = new Cli(args.Get("cli"));
        string work = Path.GetFullPath(args.Get("work"));
        string demo = Path.GetFullPath(args.Get("demo", "demo-catalogue"));
        var crops = args.Get("crops", "none,standard,dense").Split(',');
        var tradeOffCrops = args.Get("tradeoff-crops", string.Join(',', crops.Where(c => c != "none"))).Split(',');
        Directory.CreateDirectory(work);

        var demoQueries = QuerySets.Demo(demo);
        var refQueries = QuerySets.Reference(Path.Combine(work, "ref"), args.Int("snapshots", 3));
        string demoIndex = Path.Combine(work, "demo.lookup");
        string refIndex = Path.Combine(work, "ref.lookup");
        cli.Ingest(Path.Combine(demo, "photos"), demoIndex);
        cli.Ingest(Path.Combine(work, "ref", "catalogue"), refIndex);
        Console.WriteLine($"{demoQueries.Count} demo queries, {refQueries.Count} reference queries; load {File.ReadAllText("/proc/loadavg").Split(' ')[0]}");

        var all = demoQueries.Concat(refQueries).ToList();
        var results = new Dictionary<string, Dictionary<string, List<Ranked>>>();
        Console.WriteLine();
        Console.WriteLine("| set | queries (known / not stocked) | crops | top-1 | top-5 | wall s (whole run) |");
        Console.WriteLine("| --- | --- | --- | ---: | ---: | ---: |");
        foreach (var mode in crops)
        {
            var (demoRankings, demoWall) = cli.MatchEach(demoIndex, demoQueries, mode, Path.Combine(work, $"demo-{mode}.json"));
            var (refRankings, refWall) = cli.MatchEach(refIndex, refQueries, mode, Path.Combine(work, $"ref-{mode}.json"));
            var rankings = demoRankings.Concat(refRankings).ToDictionary(kv => kv.Key, kv => kv.Value, StringComparer.Ordinal);
            results[mode] = rankings;
            foreach (var set in all.Select(q => q.Set).Distinct())
            {
                var members = all.Where(q => q.Set == set).ToList();
                var known = members.Where(q => q.Truth is not null).ToList();
                string wall = set == QuerySets.DemoField ? Seconds(demoWall) : set == all.First(q => q.Set != QuerySets.DemoField).Set ? Seconds(refWall) + " (all ref)" : "";
                Console.WriteLine(known.Count == 0
                    ? $"| {set} | 0 / {members.Count} | {mode} | – | – | {wall} |"
                    : $"| {set} | {known.Count} / {members.Count - known.Count} | {mode} | {Share(known.Count(q => RankOf(rankings, q) == 0), known.Count)} | {Share(known.Count(q => RankOf(rankings, q) is >= 0 and < 5), known.Count)} | {wall} |");
            }
        }

        foreach (var mode in tradeOffCrops)
        {
            foreach (var (name, queries) in new[]
            {
                ("demo field photos", demoQueries),
                ("reference photos, whole", refQueries.Where(q => q.Set is QuerySets.RefPartners or QuerySets.RefEdits or QuerySets.RefHeldOut).ToList()),
                ("reference snapshots", refQueries.Where(q => q.Group is not null).ToList()),
            })
            {
                TradeOff(name, mode, queries, results[mode]);
            }
        }

        foreach (var mode in crops)
        {
            FusionTable(mode, refQueries.Where(q => q.Group is not null && q.Truth is not null).ToList(), results[mode]);
        }

        return 0;
    }

    /// <summary>Position of the true SKU in the query's ranking; −1 when absent or not stocked.</summary>
    private static int RankOf(Dictionary<string, List<Ranked>> rankings, Query q) =>
        q.Truth is null || !rankings.TryGetValue(q.File, out var r) ? -1 : r.FindIndex(x => x.Sku == q.Truth);

    private static void TradeOff(string name, string crops, List<Query> queries, Dictionary<string, List<Ranked>> rankings)
    {
        var known = queries.Where(q => q.Truth is not null).ToList();
        var unknown = queries.Where(q => q.Truth is null).ToList();
        Console.WriteLine();
        Console.WriteLine($"Trade-off, {name} ({known.Count} stocked, {unknown.Count} not stocked; crops {crops}):");
        Console.WriteLine();
        Console.WriteLine("| same part ≤ | margin ≥ | stocked: right and sure | unsure, right SKU listed | wrong and sure | no match | not stocked: no match | unsure | wrong and sure |");
        Console.WriteLine("| ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |");
        foreach (var samePart in SamePartGrid)
        {
            foreach (var margin in MarginGrid)
            {
                var t = VerdictThresholds.Default with { SamePart = samePart, MinMargin = margin };
                int rightSure = 0, rightUnsure = 0, wrongSure = 0, missed = 0, rejected = 0, unsure = 0, falseSure = 0;
                foreach (var q in queries)
                {
                    var top = rankings[q.File][0];
                    var verdict = VerdictRule.Decide(top.Verdict == "same file", top.Distance, top.Margin, top.WholePhotoDistance, null, t);
                    bool sure = verdict is Verdict.SameFile or Verdict.SamePhoto or Verdict.SamePart;
                    if (q.Truth is not null)
                    {
                        bool right = top.Sku == q.Truth;
                        bool listed = rankings[q.File].Take(5).Any(r => r.Sku == q.Truth && r.Distance <= samePart);
                        rightSure += right && sure ? 1 : 0;
                        rightUnsure += listed && verdict == Verdict.Unsure ? 1 : 0;
                        wrongSure += !right && sure ? 1 : 0;
                        missed += verdict == Verdict.NoMatch ? 1 : 0;
                    }
                    else
                    {
                        rejected += verdict == Verdict.NoMatch ? 1 : 0;
                        unsure += verdict == Verdict.Unsure ? 1 : 0;
                        falseSure += sure ? 1 : 0;
                    }
                }

                Console.WriteLine(Invariant($"| {samePart:0.00} | {margin:0.00} | {Share(rightSure, known.Count)} | {Share(rightUnsure, known.Count)} | {Share(wrongSure, known.Count)} | {Share(missed, known.Count)} | {Share(rejected, unknown.Count)} | {Share(unsure, unknown.Count)} | {Share(falseSure, unknown.Count)} |"));
            }
        }

        var knownD = known.Where(q => rankings[q.File][0].Sku == q.Truth).Select(q => rankings[q.File][0].Distance).Order().ToList();
        var unknownD = unknown.Select(q => rankings[q.File][0].Distance).Order().ToList();
        Console.WriteLine();
        Console.WriteLine(Invariant($"Nearest-SKU distance: right answers {Range(knownD)}; not stocked {Range(unknownD)}."));
    }

    /// <summary>Several snapshots of one subject: each alone, the best of them, and fused by min and by mean.</summary>
    private static void FusionTable(string crops, List<Query> queries, Dictionary<string, List<Ranked>> rankings)
    {
        int groups = 0, singlesRight = 0, singles = 0, anyRight = 0, minRight = 0, meanRight = 0, meanAtLeastBest = 0, minAtLeastBest = 0;
        foreach (var group in queries.GroupBy(q => q.Group))
        {
            var members = group.ToList();
            string truth = members[0].Truth!;
            var perPhoto = members.Select(q => rankings[q.File].ToDictionary(r => r.Sku, r => r.Distance)).ToList();
            var skus = perPhoto.SelectMany(p => p.Keys).Distinct().ToList();
            int bestSingle = members.Select(q => Rank(rankings[q.File].Select(r => (r.Sku, r.Distance)), truth)).Min();
            int byMin = Rank(skus.Select(s => (s, perPhoto.Min(p => p.GetValueOrDefault(s, 2f)))), truth);
            int byMean = Rank(skus.Select(s => (s, perPhoto.Average(p => p.GetValueOrDefault(s, 2f)))), truth);
            groups++;
            singles += members.Count;
            singlesRight += members.Count(q => rankings[q.File][0].Sku == truth);
            anyRight += bestSingle == 0 ? 1 : 0;
            minRight += byMin == 0 ? 1 : 0;
            meanRight += byMean == 0 ? 1 : 0;
            minAtLeastBest += byMin <= bestSingle ? 1 : 0;
            meanAtLeastBest += byMean <= bestSingle ? 1 : 0;
        }

        Console.WriteLine();
        Console.WriteLine($"Fusion, {groups} groups of snapshots of one subject (crops {crops}): single photos top-1 {Share(singlesRight, singles)}; " +
            $"best single photo top-1 {Share(anyRight, groups)}; fused min top-1 {Share(minRight, groups)} (rank ≤ best single in {Share(minAtLeastBest, groups)}); " +
            $"fused mean top-1 {Share(meanRight, groups)} (rank ≤ best single in {Share(meanAtLeastBest, groups)}).");
    }

    private static int Rank(IEnumerable<(string Sku, float Distance)> scores, string truth)
    {
        var ordered = scores.OrderBy(s => s.Distance).ThenBy(s => s.Sku, StringComparer.Ordinal).ToList();
        int i = ordered.FindIndex(s => s.Sku == truth);
        return i < 0 ? int.MaxValue : i;
    }

    private static string Share(int part, int whole) =>
        whole == 0 ? "–" : Invariant($"{part}/{whole} ({100.0 * part / whole:0} %)");

    private static string Range(List<float> values) =>
        values.Count == 0 ? "–" : Invariant($"{values[0]:0.000}–{values[^1]:0.000} (median {values[values.Count / 2]:0.000})");

    private static string Seconds(TimeSpan t) => t.TotalSeconds.ToString("0.0", CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

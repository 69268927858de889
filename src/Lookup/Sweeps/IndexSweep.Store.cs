using System.Text.Json;
using Lookup.Store;

namespace Lookup.Sweeps;

/// <summary>Storing a sweep: the writer lock for one transaction, waiting a bounded time for another writer.</summary>
public static partial class IndexSweep
{
    private static readonly TimeSpan RetryInterval = TimeSpan.FromMilliseconds(500);

    private static (int? Number, string? NotStoredReason) Store(
        string indexPath, SweepReport decided, int newFindings, TimeSpan wait, CancellationToken cancellationToken)
    {
        var deadline = DateTime.UtcNow + wait;
        while (true)
        {
            try
            {
                using var file = IndexFile.Open(indexPath, IndexAccess.Write);
                return (new SweepStore(file).Save(Summary(decided, newFindings), Findings(decided)), null);
            }
            catch (IndexFileException e) when (e.Problem is IndexFileProblem.AccessDenied or IndexFileProblem.WriteFailed)
            {
                return (null, $"{e.Message} This sweep was reported but not stored.");
            }
            catch (IndexFileException e) when (e.Problem == IndexFileProblem.WriterActive)
            {
                var left = deadline - DateTime.UtcNow;
                if (left <= TimeSpan.Zero)
                {
                    var holder = e.Holder?.ToString() ?? "another process";
                    return (null, $"{indexPath} is being written by {holder}; this sweep was reported but not stored. " +
                        "Run the sweep again when the writer has finished (or wait for it with a longer store wait) so later " +
                        "new-only sweeps compare with it.");
                }

                cancellationToken.WaitHandle.WaitOne(left < RetryInterval ? left : RetryInterval);
                cancellationToken.ThrowIfCancellationRequested();
            }
        }
    }

    private static StoredSweep Summary(SweepReport decided, int newFindings) => new(
        0,
        decided.StartedAt.UtcDateTime,
        decided.FinishedAt.UtcDateTime,
        decided.Counts.Photos,
        decided.Counts.Skus,
        decided.Counts.PairsExamined,
        decided.Findings.Count,
        newFindings,
        decided.FindingsByKind.ToDictionary(k => FindingKindText.Code(k.Key), k => k.Value, StringComparer.Ordinal),
        JsonSerializer.Serialize(decided.Settings, SweepJsonWriter.Options),
        $"{Environment.UserName}@{Environment.MachineName}");

    private static List<StoredFinding> Findings(SweepReport decided)
    {
        var stored = new List<StoredFinding>(decided.Findings.Count);
        for (var i = 0; i < decided.Findings.Count; i++)
        {
            var finding = decided.Findings[i];
            var pathOf = finding.Members.GroupBy(m => m.PhotoId).ToDictionary(g => g.Key, g => g.First().Path);
            stored.Add(new StoredFinding(
                0,
                i + 1,
                finding.Kind,
                finding.Key,
                [.. finding.Members.Select(m => new StoredMember(m.Path, m.Sku, m.Sha256))],
                [.. finding.Pairs.Select(p => new StoredPair(
                    p.Key,
                    pathOf.GetValueOrDefault(p.FirstPhotoId, ""),
                    pathOf.GetValueOrDefault(p.SecondPhotoId, ""),
                    p.Evidence.Distance,
                    FindingKindText.Relation(p.Relation, p.Evidence.Edits)))]));
        }

        return stored;
    }
}

namespace Lookup.Catalogue;

internal sealed partial class ChangePlanner
{
    /// <summary>The state of one planning pass.</summary>
    private sealed class Run(
        ChangePlanner planner,
        Dictionary<string, KnownPhoto> known,
        IReadOnlyCollection<string> unreadable,
        ChangePlanOptions options,
        CancellationToken cancellationToken)
    {
        private readonly List<PlannedChange> _items = [];
        private readonly List<(MappedEntry Photo, string Sha256)> _arrivals = [];
        private int _hashed;

        public ChangePlan Plan(IReadOnlyList<MappedEntry> current)
        {
            var present = new HashSet<string>(StringComparer.Ordinal);
            foreach (var photo in current)
            {
                cancellationToken.ThrowIfCancellationRequested();
                if (!present.Add(photo.Entry.RelativePath))
                {
                    throw new ArgumentException(
                        $"the scan lists {photo.Entry.RelativePath} twice; each current photo needs a unique relative path.",
                        nameof(current));
                }

                PlanPresent(photo);
            }

            var departed = known.Values
                .Where(k => !present.Contains(k.RelativePath))
                .OrderBy(k => k.RelativePath, StringComparer.Ordinal)
                .ToList();
            PlanMovesAndDepartures(departed);
            _items.Sort((a, b) => string.CompareOrdinal(a.RelativePath, b.RelativePath));
            return new ChangePlan(_items, _hashed);
        }

        private void PlanPresent(MappedEntry photo)
        {
            var path = photo.Entry.RelativePath;
            known.TryGetValue(path, out var record);
            if (record is not null && record.Size == photo.Entry.Size && record.MtimeUtcTicks == photo.Entry.MtimeUtcTicks)
            {
                _items.Add(SameContent(record, photo, record.Sha256));
                return;
            }

            var (sha, error) = Hash(photo.Entry.FullPath);
            if (sha is null)
            {
                _items.Add(new PlannedChange(ChangeKind.HashFailed, path, record, photo, null, error));
            }
            else if (record is null)
            {
                _arrivals.Add((photo, sha));
            }
            else if (string.Equals(sha, record.Sha256, StringComparison.OrdinalIgnoreCase))
            {
                _items.Add(SameContent(record, photo, sha));
            }
            else
            {
                _items.Add(new PlannedChange(ChangeKind.Changed, path, record, photo, sha));
            }
        }

        private static PlannedChange SameContent(KnownPhoto record, MappedEntry photo, string? sha)
        {
            var item = new PlannedChange(ChangeKind.Unchanged, photo.Entry.RelativePath, record, photo, sha);
            return item.SkuDiffers ? item with { Kind = ChangeKind.SkuChanged }
                : item.MetadataDiffers ? item with { Kind = ChangeKind.Touched }
                : item;
        }

        private void PlanMovesAndDepartures(List<KnownPhoto> departed)
        {
            var sources = new Dictionary<string, Queue<KnownPhoto>>(StringComparer.OrdinalIgnoreCase);
            foreach (var record in departed)
            {
                if (IsUnreadable(record.RelativePath))
                {
                    _items.Add(new PlannedChange(ChangeKind.Unverified, record.RelativePath, record, null, record.Sha256));
                }
                else if (record.Sha256 is { } sha)
                {
                    (sources.TryGetValue(sha, out var queue) ? queue : sources[sha] = new Queue<KnownPhoto>()).Enqueue(record);
                }
                else
                {
                    _items.Add(Departure(record));
                }
            }

            foreach (var (photo, sha) in _arrivals.OrderBy(a => a.Photo.Entry.RelativePath, StringComparer.Ordinal))
            {
                var moved = sources.TryGetValue(sha, out var queue) && queue.TryDequeue(out var source) ? source : null;
                _items.Add(new PlannedChange(moved is null ? ChangeKind.New : ChangeKind.Moved,
                    photo.Entry.RelativePath, moved, photo, sha));
            }

            _items.AddRange(sources.Values.SelectMany(q => q).Select(Departure));
        }

        private PlannedChange Departure(KnownPhoto record) =>
            new(options.KeepMissing ? ChangeKind.Missing : ChangeKind.Gone, record.RelativePath, record, null, record.Sha256);

        private bool IsUnreadable(string relativePath) =>
            unreadable.Any(u => u.Length == 0 || relativePath == u
                || (relativePath.StartsWith(u, StringComparison.Ordinal) && relativePath.Length > u.Length && relativePath[u.Length] == '/'));

        private (string? Sha, string? Error) Hash(string fullPath)
        {
            _hashed++;
            try
            {
                return (planner._hashFile(fullPath), null);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                return (null, $"{fullPath} could not be read to compute its SHA-256 ({e.Message}); check the file and run again.");
            }
        }
    }
}

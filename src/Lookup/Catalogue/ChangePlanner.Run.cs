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
        private readonly List<MappedEntry> _arrivals = [];
        private int _hashed;

        public ChangePlan Plan(IReadOnlyList<MappedEntry> current)
        {
            var present = new HashSet<string>(StringComparer.Ordinal);
            foreach (var photo in current)
            {
                if (!present.Add(photo.Entry.RelativePath))
                {
                    throw new ArgumentException(
                        $"the scan lists {photo.Entry.RelativePath} twice; each current photo needs a unique relative path.",
                        nameof(current));
                }
            }

            foreach (var photo in current)
            {
                PlanPresent(photo);
            }

            var departed = known.Values
                .Where(k => !present.Contains(k.RelativePath))
                .OrderBy(k => k.RelativePath, StringComparer.Ordinal)
                .ToList();
            PlanArrivalsAndDepartures(departed);
            _items.Sort((a, b) => string.CompareOrdinal(a.RelativePath, b.RelativePath));
            return new ChangePlan(_items, _hashed);
        }

        private void PlanPresent(MappedEntry photo)
        {
            var path = photo.Entry.RelativePath;
            if (!known.TryGetValue(path, out var record))
            {
                _arrivals.Add(photo);
                return;
            }

            if (record.Size == photo.Entry.Size && record.MtimeUtcTicks == photo.Entry.MtimeUtcTicks)
            {
                _items.Add(SameContent(record, photo, record.Sha256));
                return;
            }

            var (sha, error) = Hash(photo.Entry.FullPath);
            _items.Add(sha is null ? new PlannedChange(ChangeKind.HashFailed, path, record, photo, null, error)
                : string.Equals(sha, record.Sha256, StringComparison.OrdinalIgnoreCase) ? SameContent(record, photo, sha)
                : new PlannedChange(ChangeKind.Changed, path, record, photo, sha));
        }

        private static PlannedChange SameContent(KnownPhoto record, MappedEntry photo, string? sha)
        {
            var item = new PlannedChange(ChangeKind.Unchanged, photo.Entry.RelativePath, record, photo, sha);
            return item.SkuDiffers ? item with { Kind = ChangeKind.SkuChanged }
                : item.MetadataDiffers ? item with { Kind = ChangeKind.Touched }
                : item;
        }

        private void PlanArrivalsAndDepartures(List<KnownPhoto> departed)
        {
            // Move sources: departed photos with a known hash, queued per hash in path order.
            var sources = new Dictionary<string, Queue<KnownPhoto>>(StringComparer.OrdinalIgnoreCase);
            var sourceSizes = new HashSet<long>();
            foreach (var record in departed)
            {
                if (IsUnreadable(record.RelativePath))
                {
                    _items.Add(new PlannedChange(ChangeKind.Unverified, record.RelativePath, record, null, record.Sha256));
                }
                else if (record.Sha256 is { } sha)
                {
                    (sources.TryGetValue(sha, out var queue) ? queue : sources[sha] = new Queue<KnownPhoto>()).Enqueue(record);
                    sourceSizes.Add(record.Size);
                }
                else
                {
                    _items.Add(Departure(record));
                }
            }

            foreach (var photo in _arrivals.OrderBy(a => a.Entry.RelativePath, StringComparer.Ordinal))
            {
                _items.Add(PlanArrival(photo, sources, sourceSizes));
            }

            _items.AddRange(sources.Values.SelectMany(q => q).Select(Departure));
        }

        private PlannedChange PlanArrival(MappedEntry photo, Dictionary<string, Queue<KnownPhoto>> sources, HashSet<long> sourceSizes)
        {
            var path = photo.Entry.RelativePath;
            // Identical content has identical length, so only a file as long as some departed photo can be a move.
            if (!options.HashEveryNewFile && !sourceSizes.Contains(photo.Entry.Size))
            {
                return new PlannedChange(ChangeKind.New, path, null, photo, null);
            }

            var (sha, error) = Hash(photo.Entry.FullPath);
            if (sha is null)
            {
                return new PlannedChange(ChangeKind.HashFailed, path, null, photo, null, error);
            }

            var source = sources.TryGetValue(sha, out var queue) && queue.TryDequeue(out var first) ? first : null;
            return new PlannedChange(source is null ? ChangeKind.New : ChangeKind.Moved, path, source, photo, sha);
        }

        private PlannedChange Departure(KnownPhoto record) =>
            new(options.KeepMissing ? ChangeKind.Missing : ChangeKind.Gone, record.RelativePath, record, null, record.Sha256);

        private bool IsUnreadable(string relativePath) =>
            unreadable.Any(u => u.Length == 0 || relativePath == u
                || (relativePath.StartsWith(u, StringComparison.Ordinal) && relativePath.Length > u.Length && relativePath[u.Length] == '/'));

        private (string? Sha, string? Error) Hash(string fullPath)
        {
            cancellationToken.ThrowIfCancellationRequested();
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

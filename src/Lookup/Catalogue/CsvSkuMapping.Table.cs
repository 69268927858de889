namespace Lookup.Catalogue;

internal sealed partial class CsvSkuMapping
{
    /// <summary>The rows of one CSV file, checked one by one and then matched against the scan.</summary>
    private sealed class Table(CsvSkuMapping owner, Header header)
    {
        private readonly Dictionary<string, Row> _rows = new(PathKey.Comparer);
        private readonly HashSet<string> _explained = new(PathKey.Comparer);
        private readonly List<MappingProblem> _problems = [];
        private readonly string _folder = Path.GetDirectoryName(owner._csvPath) ?? "";

        private string Csv => owner._csvPath;

        public void Add(CsvRecord record)
        {
            if (IsBlank(record))
            {
                return;
            }

            if (record.Error is not null)
            {
                Malformed(record.Line, record.Error);
                return;
            }

            if (record.Fields.Count != header.FieldCount)
            {
                Malformed(record.Line, $"the row has {record.Fields.Count} fields but the header has {header.FieldCount}; "
                    + "enclose cells that contain commas in quotes");
                return;
            }

            var file = record.Fields[header.FileColumn].Trim();
            var sku = record.Fields[header.SkuColumn].Trim();
            if (file.Length == 0)
            {
                Malformed(record.Line, "the file cell is empty; give the photo's path relative to the table's folder");
                return;
            }

            string path;
            try
            {
                // Tables are often written on Windows: a backslash is read as a folder separator everywhere.
                path = Path.GetFullPath(file.Replace('\\', '/'), _folder);
            }
            catch (ArgumentException e)
            {
                Malformed(record.Line, $"'{file}' is not a usable path ({e.Message})");
                return;
            }

            if (sku.Length == 0)
            {
                _explained.Add(path);
                Problem(MappingProblemKind.EmptySku, ProblemSeverity.Error, path, record.Line,
                    $"{Csv} line {record.Line}: the SKU for {file} is empty; fill it in or delete the row.");
                return;
            }

            AddRow(path, file, sku, record.Line);
        }

        private void AddRow(string path, string file, string sku, int line)
        {
            if (!_rows.TryGetValue(path, out var first))
            {
                _rows[path] = new Row(sku, line, file);
                return;
            }

            if (string.Equals(first.Sku, sku, StringComparison.Ordinal))
            {
                Problem(MappingProblemKind.DuplicateRow, ProblemSeverity.Warning, path, line,
                    $"{Csv} line {line}: {file} is listed again with the same SKU {sku} (first on line {first.Line}); delete one row.");
                return;
            }

            first.Conflicting = true;
            _explained.Add(path);
            Problem(MappingProblemKind.ConflictingSku, ProblemSeverity.Error, path, line,
                $"{Csv} line {line}: {file} is given SKU {sku} here but SKU {first.Sku} on line {first.Line}; "
                + "keep the right row — the photo is left without a SKU until then.");
        }

        public SkuMappingResult Resolve(IReadOnlyList<CatalogueEntry> entries)
        {
            var scanned = new HashSet<string>(entries.Select(e => e.FullPath), PathKey.Comparer);
            foreach (var (path, row) in _rows.OrderBy(r => r.Value.Line))
            {
                if (scanned.Contains(path))
                {
                    continue;
                }

                if (File.Exists(path) || Directory.Exists(path))
                {
                    Problem(MappingProblemKind.RowFileNotScanned, ProblemSeverity.Warning, path, row.Line,
                        $"{Csv} line {row.Line}: {row.File} exists but was not among the scanned photos "
                        + "(hidden, not an image, or outside the catalogue folder); move it into the catalogue or delete the row.");
                }
                else
                {
                    Problem(MappingProblemKind.RowFileMissing, ProblemSeverity.Error, path, row.Line,
                        $"{Csv} line {row.Line}: {row.File} does not exist (looked for {path}); correct the path or delete the row.");
                }
            }

            var rowProblems = _problems.OrderBy(p => p.Line).ToList();
            var photos = new List<MappedEntry>(entries.Count);
            foreach (var entry in entries)
            {
                var sku = _rows.TryGetValue(entry.FullPath, out var row) && !row.Conflicting ? row.Sku : null;
                photos.Add(new MappedEntry(entry, sku));
                if (sku is null && !_explained.Contains(entry.FullPath))
                {
                    rowProblems.Add(new MappingProblem(MappingProblemKind.Unmapped, ProblemSeverity.Error, entry.FullPath, null,
                        $"{entry.FullPath} is not listed in {Csv}; add a row {Path.GetRelativePath(_folder, entry.FullPath)},<SKU>."));
                }
            }

            return new SkuMappingResult(photos, rowProblems);
        }

        private void Malformed(int line, string why) =>
            Problem(MappingProblemKind.MalformedRow, ProblemSeverity.Error, Csv, line, $"{Csv} line {line}: {why}.");

        private void Problem(MappingProblemKind kind, ProblemSeverity severity, string path, int line, string message) =>
            _problems.Add(new MappingProblem(kind, severity, path, line, message));
    }

    /// <summary>The first row seen for one file.</summary>
    private sealed class Row(string sku, int line, string file)
    {
        public string Sku { get; } = sku;

        public int Line { get; } = line;

        public string File { get; } = file;

        public bool Conflicting { get; set; }
    }
}

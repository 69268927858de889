using System.Buffers.Binary;
using System.CommandLine;
using System.IO.Compression;
using System.Text.Json;
using Lookup.Cli;
using Lookup.Store;
using Lookup.Tests.Catalogue;
using Lookup.Tests.Embedding;

namespace Lookup.Tests.Cli;

/// <summary>
/// Runs the real <c>lookup ingest</c> command in process (parsing, model loading, index file, JSON) over trees of
/// open reference photos (tests/reference-data, see SOURCES.md), then checks the index through search: each photo's
/// fresh embedding must find the record at its path under the SKU the mapping gave.
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class IngestCommandTests(EmbedderFixture fixture) : IDisposable
{
    private readonly IngestTree tree = new();

    [Fact]
    public void Ingest_with_folder_mapping_files_each_photo_under_its_folder_and_reports_a_loose_photo_as_unmapped()
    {
        tree.Add("HB-M8/front.jpg", "opencv/apple.jpg");
        tree.Add("HB-M8/side.jpg", "opencv/baboon.jpg");
        tree.Add("NT-M6/top.png", "opencv/smarties.png");
        var loose = tree.Add("loose.jpg", "opencv/fruits.jpg");

        var (exitCode, json, _) = Ingest("--sku-from", "folder");

        Assert.Equal(1, exitCode);
        Assert.Equal((3, 1, 0), (Int(json, "new"), Int(json, "unmapped"), Int(json, "failed")));
        var problem = Assert.Single(json.GetProperty("mappingProblems").EnumerateArray());
        Assert.Equal(("Unmapped", "Error", loose), (Text(problem, "kind"), Text(problem, "severity"), Text(problem, "path")));
        var index = IndexSnapshot.Read(tree.IndexPath);
        AssertFound(index, "opencv/apple.jpg", "HB-M8/front.jpg", "HB-M8");
        AssertFound(index, "opencv/baboon.jpg", "HB-M8/side.jpg", "HB-M8");
        AssertFound(index, "opencv/smarties.png", "NT-M6/top.png", "NT-M6");
        Assert.False(index.Records.ContainsKey("loose.jpg"));
    }

    [Fact]
    public void Ingest_with_a_csv_maps_the_good_rows_and_reports_missing_files_duplicates_and_empty_skus_by_line()
    {
        foreach (var (name, reference) in new[] { ("a.jpg", "opencv/apple.jpg"), ("b.jpg", "opencv/baboon.jpg"), ("c.jpg", "opencv/fruits.jpg"), ("d.png", "opencv/smarties.png"), ("e.jpg", "opencv/home.jpg") })
        {
            tree.Add(name, reference);
        }

        var csv = tree.Outside("skus.csv");
        File.WriteAllText(csv, """
            file,sku
            photos/a.jpg,P-100
            photos/b.jpg,P-200
            photos/b.jpg,P-200
            photos/c.jpg,P-300
            photos/c.jpg,P-301
            photos/d.png,
            photos/gone.jpg,P-900
            """);

        var (exitCode, json, _) = Ingest("--sku-from", "csv:" + csv);

        Assert.Equal(1, exitCode);
        var problems = json.GetProperty("mappingProblems").EnumerateArray()
            .Select(p => (Text(p, "kind"), Text(p, "severity"), p.GetProperty("line").ValueKind == JsonValueKind.Number ? p.GetProperty("line").GetInt32() : 0))
            .ToList();
        Assert.Contains(("DuplicateRow", "Warning", 4), problems);
        Assert.Contains(("ConflictingSku", "Error", 6), problems);
        Assert.Contains(("EmptySku", "Error", 7), problems);
        Assert.Contains(("RowFileMissing", "Error", 8), problems);
        Assert.Contains(("Unmapped", "Error", 0), problems);
        Assert.Equal((2, 3), (Int(json, "new"), Int(json, "unmapped")));
        var index = IndexSnapshot.Read(tree.IndexPath);
        AssertFound(index, "opencv/apple.jpg", "a.jpg", "P-100");
        AssertFound(index, "opencv/baboon.jpg", "b.jpg", "P-200");
        Assert.Equal(["a.jpg", "b.jpg"], index.Records.Keys.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Ingest_with_a_pattern_takes_the_sku_from_the_named_group_and_exits_0()
    {
        tree.Add("shots/P-100_front.jpg", "opencv/apple.jpg");
        tree.Add("shots/P-100_side.jpg", "opencv/baboon.jpg");
        tree.Add("shots/P-200_front.png", "opencv/smarties.png");

        var (exitCode, json, _) = Ingest("--sku-from", @"pattern:^shots/(?<sku>P-\d+)_");

        Assert.Equal(0, exitCode);
        Assert.Empty(json.GetProperty("mappingProblems").EnumerateArray());
        var index = IndexSnapshot.Read(tree.IndexPath);
        AssertFound(index, "opencv/apple.jpg", "shots/P-100_front.jpg", "P-100");
        AssertFound(index, "opencv/baboon.jpg", "shots/P-100_side.jpg", "P-100");
        AssertFound(index, "opencv/smarties.png", "shots/P-200_front.png", "P-200");
    }

    [Fact]
    public void Ingest_records_every_bad_file_with_its_reason_indexes_the_good_ones_and_exits_1_then_0_once_they_are_gone()
    {
        tree.Add("BR-1/good.jpg", "opencv/apple.jpg");
        tree.Add("BR-2/good.png", "opencv/smarties.png");
        tree.Add("BR-3.jpg/inside.jpg", "opencv/baboon.jpg");
        tree.Write("BR-1/empty.jpg", []);
        // skimage/data/truncated.jpg (python3-skimage): a JPEG cut inside its Huffman table segment.
        tree.Add("BR-1/truncated.jpg", "skimage/truncated.jpg");
        var rocket = IngestTree.Bytes("skimage/rocket.jpg");
        tree.Write("BR-1/cut.jpg", rocket[..(rocket.Length * 6 / 10)]);
        tree.Write("BR-2/notes.jpg", "Part 4471-B, left hand\n"u8.ToArray());
        tree.Write("BR-2/bomb.png", PngDeclaring(40_000, 40_000));
        var expected = new Dictionary<string, string>
        {
            ["BR-1/empty.jpg"] = "EmptyFile",
            ["BR-1/truncated.jpg"] = "Corrupt",
            ["BR-1/cut.jpg"] = "Corrupt",
            ["BR-2/notes.jpg"] = "UnknownFormat",
            ["BR-2/bomb.png"] = "TooManyPixels",
        };

        var (exitCode, json, _) = Ingest();

        Assert.Equal(1, exitCode);
        Assert.Equal((3, 5), (Int(json, "embedded"), Int(json, "failed")));
        var failures = json.GetProperty("failures").EnumerateArray().ToDictionary(f => Text(f, "path")!, f => (Reason: Text(f, "reason"), Message: Text(f, "message")!));
        Assert.Equal(expected, failures.ToDictionary(f => f.Key, f => f.Value.Reason!));
        Assert.All(failures, f => Assert.Contains(tree.PathOf(f.Key), f.Value.Message, StringComparison.Ordinal));
        var folder = Assert.Single(json.GetProperty("scanProblems").EnumerateArray());
        Assert.Equal(("FolderNamedLikeImage", "BR-3.jpg"), (Text(folder, "kind"), Text(folder, "path")));
        var index = IndexSnapshot.Read(tree.IndexPath);
        Assert.Equal(expected, index.Failed.ToDictionary(r => r.Path, r => r.FailureReason!));
        Assert.All(index.Failed, r => Assert.Equal(failures[r.Path].Message, r.FailureMessage));
        Assert.All(index.Failed, r => Assert.Null(r.NodeId));
        AssertFound(index, "opencv/apple.jpg", "BR-1/good.jpg", "BR-1");
        AssertFound(index, "opencv/smarties.png", "BR-2/good.png", "BR-2");
        AssertFound(index, "opencv/baboon.jpg", "BR-3.jpg/inside.jpg", "BR-3.jpg");

        foreach (var path in expected.Keys)
        {
            File.Delete(tree.PathOf(path));
        }

        var (cleanExit, clean, _) = Ingest();

        Assert.Equal(0, cleanExit);
        Assert.Equal((5, 0, 3), (Int(clean, "retired"), Int(clean, "failed"), Int(clean, "unchanged")));
        Assert.Empty(IndexSnapshot.Read(tree.IndexPath).Failed);
    }

    [Fact]
    public void Ingest_of_an_unchanged_tree_exits_0_with_nothing_embedded_in_its_table()
    {
        tree.Add("BR-1/a.jpg", "opencv/apple.jpg");
        Ingest();

        var (exitCode, output, error) = Run("ingest", tree.Root, "--index", tree.IndexPath, "--quiet");

        Assert.Equal(0, exitCode);
        Assert.Equal("", error);
        var lines = output.Split('\n');
        Assert.Matches(@"^new\s+changed\s+unchanged\s+moved\s+updated\s+retired\s+failed\s+unmapped\s+time\s+rate$", lines[0]);
        Assert.Matches(@"^\s*0\s+0\s+1\s+0\s+0\s+0\s+0\s+0\s", lines[2]);
        Assert.Equal($"{tree.IndexPath}: 1 photos indexed.", lines[3]);
    }

    [Theory]
    [InlineData("--batch-size", "0")]
    [InlineData("--workers", "0")]
    [InlineData("--max-megapixels", "0")]
    [InlineData("--shard", "3/2")]
    [InlineData("--sku-from", "columns")]
    [InlineData("--sku-from", "pattern:(no-group)")]
    public void Ingest_with_a_bad_value_is_a_usage_error_and_creates_no_index(string option, string value)
    {
        var (exitCode, _, error) = Run("ingest", tree.Root, "--index", tree.IndexPath, option, value);

        Assert.Equal(2, exitCode);
        Assert.StartsWith("lookup ingest: ", error, StringComparison.Ordinal);
        Assert.False(File.Exists(tree.IndexPath));
    }

    [Fact]
    public void Ingest_with_a_csv_that_does_not_exist_names_it_and_creates_no_index()
    {
        var missing = tree.Outside("nowhere.csv");

        var (exitCode, _, error) = Run("ingest", tree.Root, "--index", tree.IndexPath, "--sku-from", "csv:" + missing);

        Assert.Equal(2, exitCode);
        Assert.Contains(missing, error, StringComparison.Ordinal);
        Assert.False(File.Exists(tree.IndexPath));
    }

    [Fact]
    public void Ingest_help_shows_the_batch_size_option_and_every_exit_code()
    {
        var (exitCode, output, _) = Run("ingest", "--help");

        Assert.Equal(0, exitCode);
        Assert.Contains("--batch-size", output, StringComparison.Ordinal);
        foreach (var code in new[] { "0 all photos indexed", "1 some photos failed", "2 usage error", "130 stopped by Ctrl+C" })
        {
            Assert.Contains(code, output.ReplaceLineEndings(" ").Replace("  ", " ", StringComparison.Ordinal), StringComparison.Ordinal);
        }
    }

    public void Dispose() => tree.Dispose();

    private (int ExitCode, JsonElement Json, string Error) Ingest(params string[] extra)
    {
        var (exitCode, output, error) = Run(["ingest", tree.Root, "--index", tree.IndexPath, "--json", "--quiet", "--batch-size", "2", .. extra]);
        using var document = JsonDocument.Parse(output);
        return (exitCode, document.RootElement.Clone(), error);
    }

    private static (int ExitCode, string Output, string Error) Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var exitCode = Program.Run(args, new InvocationConfiguration { Output = output, Error = error });
        return (exitCode, output.ToString(), error.ToString());
    }

    private void AssertFound(IndexSnapshot index, string reference, string path, string sku)
    {
        var (record, hit) = index.Nearest(fixture.EmbedBytes(IngestTree.Bytes(reference), reference));
        Assert.NotNull(record);
        Assert.Equal((path, sku, PhotoStatus.Indexed), (record.Path, record.Sku, record.Status));
        Assert.True(hit.Distance < 1e-4f, $"{reference} found {record.Path} at distance {hit.Distance}");
    }

    private static int Int(JsonElement json, string name) => json.GetProperty(name).GetInt32();

    private static string? Text(JsonElement json, string name) => json.GetProperty(name).GetString();

    /// <summary>
    /// A well-formed PNG (PNG specification, ISO/IEC 15948: signature, IHDR, one IDAT, IEND, valid CRCs) whose
    /// header claims <paramref name="width"/> × <paramref name="height"/> pixels: a decompression bomb's header.
    /// </summary>
    private static byte[] PngDeclaring(int width, int height)
    {
        using var png = new MemoryStream();
        png.Write([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]);
        var header = new byte[13];
        BinaryPrimitives.WriteInt32BigEndian(header, width);
        BinaryPrimitives.WriteInt32BigEndian(header.AsSpan(4), height);
        header[8] = 8; // bit depth
        header[9] = 2; // colour type: RGB
        Chunk(png, "IHDR", header);
        using (var zlib = new MemoryStream())
        {
            using (var deflate = new ZLibStream(zlib, CompressionLevel.SmallestSize, leaveOpen: true))
            {
                deflate.Write(new byte[4096]);
            }

            Chunk(png, "IDAT", zlib.ToArray());
        }

        Chunk(png, "IEND", []);
        return png.ToArray();
    }

    private static void Chunk(Stream stream, string type, byte[] data)
    {
        var typed = System.Text.Encoding.ASCII.GetBytes(type).Concat(data).ToArray();
        var word = new byte[4];
        BinaryPrimitives.WriteInt32BigEndian(word, data.Length);
        stream.Write(word);
        stream.Write(typed);
        BinaryPrimitives.WriteUInt32BigEndian(word, Crc32(typed));
        stream.Write(word);
    }

    /// <summary>CRC-32 as the PNG specification defines it (annex D): reflected polynomial 0xEDB88320.</summary>
    private static uint Crc32(byte[] data)
    {
        var crc = 0xFFFFFFFFu;
        foreach (var b in data)
        {
            crc ^= b;
            for (var k = 0; k < 8; k++)
            {
                crc = (crc & 1) != 0 ? 0xEDB88320u ^ (crc >> 1) : crc >> 1;
            }
        }

        return ~crc;
    }
}

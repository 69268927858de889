using System.Text.Json;
using Lookup.Graph;
using Lookup.Store;
using Lookup.Tests.Imaging;
using Lookup.Tests.Store;

namespace Lookup.Tests.Cli;

/// <summary>What <c>lookup match</c> says when it cannot answer: the file, the reason and the fix, no stack trace.</summary>
[Collection(MatchCollection.Name)]
public sealed class MatchCommandErrorTests(MatchIndexFixture index) : IDisposable
{
    private readonly TempIndex temp = new();

    [Fact]
    public void A_missing_index_exits_1_naming_it_and_ingest()
    {
        var missing = Path.Combine(temp.Directory, "nowhere.lookup");

        var (exitCode, output, error) = Run(ReferenceData.OpenCv("graf3.png"), "--index", missing);

        Assert.Equal((1, ""), (exitCode, output));
        Assert.StartsWith($"lookup match: {missing} does not exist", error, StringComparison.Ordinal);
        Assert.Contains("ingest", error, StringComparison.Ordinal);
        NoStackTrace(error);
    }

    [Fact]
    public void An_index_built_with_another_model_is_refused_naming_both_models_and_the_fix()
    {
        using (var file = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            var store = new GraphStore(file);
            var graph = store.Create(512, new HnswParameters(), "f00dfeed" + new string('0', 56));
            var random = new Random(5);
            graph.Add([.. Enumerable.Range(0, 512).Select(_ => (float)random.NextDouble())]);
            file.InTransaction(() =>
            {
                store.Commit(graph);
                new PhotoTable(file).Upsert(new PhotoRecord { Path = "X/x.jpg", Sku = "X", Sha256 = "ab", Status = PhotoStatus.Indexed, NodeId = 0 });
                new CatalogueSettings("/photos", "folder", """{ "name": "parts-net", "onnxFile": "parts.onnx", "inputName": "pixels", "outputName": "features" }""", "f00dfeed" + new string('0', 56), DateTime.UnixEpoch).Write(file);
            });
        }

        var (exitCode, _, error) = Run(ReferenceData.OpenCv("graf3.png"), "--index", temp.Path);

        Assert.Equal(1, exitCode);
        Assert.Contains($"{temp.Path} was built with model card 'parts-net' (fingerprint f00dfeed0000…", error, StringComparison.Ordinal);
        Assert.Contains("this run uses model card 'resnet18'", error, StringComparison.Ordinal);
        Assert.Contains("pass --model with the card the index was built with", error, StringComparison.Ordinal);
        NoStackTrace(error);
    }

    [Fact]
    public void An_index_without_photos_exits_1_saying_to_ingest_first()
    {
        using (IndexFile.Open(temp.Path, IndexAccess.Write))
        {
        }

        var (exitCode, _, error) = Run(ReferenceData.OpenCv("graf3.png"), "--index", temp.Path);

        Assert.Equal(1, exitCode);
        Assert.Contains($"{temp.Path} holds no graph yet: run ingest", error, StringComparison.Ordinal);
        NoStackTrace(error);
    }

    [Fact]
    public void An_index_whose_photos_were_all_retired_exits_1_saying_so()
    {
        using (var file = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            var store = new GraphStore(file);
            var graph = store.Create(4, new HnswParameters(), "fp");
            graph.Add([1f, 0, 0, 0]);
            graph.Delete(0);
            file.InTransaction(() => store.Commit(graph));
        }

        var (exitCode, _, error) = Run(ReferenceData.OpenCv("graf3.png"), "--index", temp.Path);

        Assert.Equal(1, exitCode);
        Assert.Contains("holds no indexed photos (1 were indexed and all have been retired)", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Photos_that_cannot_be_used_are_named_on_stderr_and_the_others_are_still_answered()
    {
        var missing = Path.Combine(temp.Directory, "missing.jpg");
        var truncated = ReferenceData.SkImage("truncated.jpg"); // python3-skimage: a JPEG cut short

        var (exitCode, output, error) = Run(missing, ReferenceData.OpenCv("graf3.png"), truncated, "--index", index.Index, "--each", "--json", "--crops", "none");

        Assert.Equal(1, exitCode);
        Assert.Contains($"lookup match: {missing}: the file could not be read", error, StringComparison.Ordinal);
        Assert.Contains($"lookup match: {truncated}: the JPEG data is truncated or damaged", error, StringComparison.Ordinal);
        NoStackTrace(error);
        using var json = JsonDocument.Parse(output);
        var answer = json.RootElement.GetProperty("answers").EnumerateArray().Single();
        Assert.Equal("graf1", answer.GetProperty("ranking")[0].GetProperty("sku").GetString());
        Assert.Equal(["unreadable", "corrupt"], json.RootElement.GetProperty("failures").EnumerateArray().Select(f => f.GetProperty("reason").GetString()));
    }

    [Fact]
    public void Like_an_unknown_photo_or_SKU_exits_1_saying_what_to_give()
    {
        var (exitCode, _, error) = Run("--like", "NO-SUCH-SKU", "--index", index.Index);

        Assert.Equal(1, exitCode);
        Assert.Contains("'NO-SUCH-SKU' is neither a photo nor a SKU in ", error, StringComparison.Ordinal);
        Assert.Contains("relative to the catalogue root", error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--index", "x.lookup")]
    [InlineData("a.jpg", "--index", "x.lookup", "--json", "--csv")]
    [InlineData("a.jpg", "--index", "x.lookup", "--top", "0")]
    [InlineData("a.jpg", "--index", "x.lookup", "--crops", "all")]
    [InlineData("a.jpg", "--index", "x.lookup", "--like", "SKU")]
    [InlineData("--like", "SKU", "--index", "x.lookup", "--each")]
    [InlineData("a.jpg")]
    public void Wrong_command_lines_exit_2(params string[] args)
    {
        var (exitCode, _, error) = Run(args);

        Assert.Equal(2, exitCode);
        Assert.NotEqual("", error);
    }

    public void Dispose() => temp.Dispose();

    private static void NoStackTrace(string error) => Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);

    private static (int ExitCode, string Output, string Error) Run(params string[] args) => MatchIndexFixture.Run(["match", .. args]);
}

using System.Text.Json;
using Lookup.Matching;
using Lookup.Tests.Imaging;
using Lookup.Tests.Matching;

namespace Lookup.Tests.Cli;

/// <summary>
/// The real <c>lookup match</c> on an index ingested from reference photos (tests/reference-data, see SOURCES.md):
/// the pair and Copydays checks of the embedding tests, asked through the command, plus verdicts, fusion and output.
/// </summary>
[Collection(MatchCollection.Name)]
public sealed class MatchCommandTests(MatchIndexFixture index)
{
    [Fact]
    public void Every_reference_pair_partner_and_Copydays_copy_ranks_its_own_photo_first()
    {
        // Pairs: opencv-doc (ReferencePairTests); copies: the Copydays protocol's edits (CopyDetectionTests).
        var expected = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (filed, partner) in ReferenceCatalogue.Pairs.Where(p => p.Filed != "box.png"))
        {
            expected[ReferenceData.OpenCv(partner)] = $"{ReferenceCatalogue.SkuOf(filed)}/{filed}";
        }

        foreach (var original in ReferenceCatalogue.SkImageOriginals)
        {
            foreach (var edit in CopydaysEdits.Names)
            {
                var copy = index.Query($"{ReferenceCatalogue.SkuOf(original)}-{edit}.img", CopydaysEdits.Apply(ReferenceData.SkImage(original), edit));
                expected[copy] = $"{ReferenceCatalogue.SkuOf(original)}/{original}";
            }
        }

        var (exitCode, output, error) = Run([.. expected.Keys, "--index", index.Index, "--each", "--json", "--crops", "none", "--top", "3"]);

        Assert.True(exitCode == 0, error);
        using var json = JsonDocument.Parse(output);
        var answers = json.RootElement.GetProperty("answers").EnumerateArray().ToList();
        Assert.Equal(42, answers.Count);
        foreach (var answer in answers)
        {
            var photo = answer.GetProperty("photos")[0].GetString()!;
            var first = answer.GetProperty("ranking")[0];
            Assert.True(first.GetProperty("bestPhoto").GetString() == expected[photo], $"{photo}: first was {first}");
            Assert.Equal(expected[photo].Split('/')[0], first.GetProperty("sku").GetString());
        }
    }

    [Fact]
    public void The_box_seen_small_on_a_cluttered_table_is_found_with_the_dense_crops()
    {
        // opencv-doc box.png / box_in_scene.png: the object alone and the object in a scene. The standard crops
        // (the default, chosen for the latency target) miss it; the dense grid is what finds a small object.
        var (exitCode, output, _) = Run(ReferenceData.OpenCv("box_in_scene.png"), "--index", index.Index, "--crops", "dense", "--json");

        Assert.Equal(0, exitCode);
        using var json = JsonDocument.Parse(output);
        Assert.Equal("box", json.RootElement.GetProperty("answers")[0].GetProperty("ranking")[0].GetProperty("sku").GetString());
    }

    [Fact]
    public void Photos_of_things_not_in_the_index_come_back_no_match_with_the_default_thresholds()
    {
        var heldOut = ReferenceCatalogue.Others().HeldOut;
        var snapshot = index.Query("held-out-snapshot.jpg", BenchSnapshot.Make(
            ReferenceData.OpenCv("butterfly.jpg"), ReferenceData.OpenCv(BenchSnapshot.Backgrounds[0]), BenchSnapshot.PlacementFor(11)));
        string[] photos = [ReferenceData.OpenCv("butterfly.jpg"), ReferenceData.OpenCv("messi5.jpg"), snapshot];
        Assert.All(photos.Take(2), p => Assert.Contains(Path.GetFileName(p), heldOut));

        var (exitCode, output, _) = Run([.. photos, "--index", index.Index, "--each", "--json"]);

        Assert.Equal(0, exitCode);
        using var json = JsonDocument.Parse(output);
        foreach (var answer in json.RootElement.GetProperty("answers").EnumerateArray())
        {
            Assert.True(answer.GetProperty("verdict").GetString() == "no match", answer.ToString());
            Assert.Equal(JsonValueKind.Null, answer.GetProperty("sku").ValueKind);
        }
    }

    [Fact]
    public void A_file_with_the_same_bytes_as_a_catalogue_photo_is_reported_as_the_same_file()
    {
        var (exitCode, output, _) = Run(ReferenceData.SkImage("coffee.png"), "--index", index.Index, "--crops", "none");

        Assert.Equal(0, exitCode);
        var row = output.Split('\n').First(l => l.TrimStart().StartsWith("1 ", StringComparison.Ordinal));
        Assert.Matches(@"^\s+1\s+coffee\s+0\.0000\s+same file\s+1/1\s+coffee/coffee\.png$", row);
        Assert.Contains("Answer: coffee: the same file is in the catalogue as coffee/coffee.png.", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Several_snapshots_of_one_subject_fused_rank_it_at_least_as_well_as_the_best_single_snapshot()
    {
        foreach (var (subject, sku, seed) in new[] { ("graf3.png", "graf1", 100), ("aloeR.jpg", "aloeL", 200) })
        {
            var snapshots = Enumerable.Range(0, 3).Select(i => index.Query($"{sku}-snap-{i}.jpg", BenchSnapshot.Make(
                ReferenceData.OpenCv(subject), ReferenceData.OpenCv(BenchSnapshot.Backgrounds[i % 2]), BenchSnapshot.PlacementFor(seed + i)))).ToArray();

            var (_, eachOutput, _) = Run([.. snapshots, "--index", index.Index, "--each", "--json", "--crops", "standard", "--top", "40"]);
            var (exitCode, fusedOutput, _) = Run([.. snapshots, "--index", index.Index, "--json", "--crops", "standard", "--top", "40"]);

            Assert.Equal(0, exitCode);
            using var each = JsonDocument.Parse(eachOutput);
            using var fused = JsonDocument.Parse(fusedOutput);
            int bestSingle = each.RootElement.GetProperty("answers").EnumerateArray().Select(a => RankOf(a, sku)).Min();
            var answer = fused.RootElement.GetProperty("answers").EnumerateArray().Single();
            Assert.Equal(3, answer.GetProperty("photos").GetArrayLength());
            Assert.True(RankOf(answer, sku) <= bestSingle, $"{sku}: fused rank {RankOf(answer, sku)}, best single {bestSingle}");
        }
    }

    [Fact]
    public void The_table_is_aligned_and_every_answer_ends_with_the_caution()
    {
        var (exitCode, output, _) = Run(ReferenceData.OpenCv("graf3.png"), ReferenceData.OpenCv("butterfly.jpg"), "--index", index.Index, "--each", "--crops", "none", "--top", "3");

        Assert.Equal(0, exitCode);
        var blocks = output.Split("\n\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(3, blocks.Length);
        foreach (var block in blocks.Take(2))
        {
            var lines = block.Split('\n');
            Assert.EndsWith(" (whole photo)", lines[0], StringComparison.Ordinal);
            Assert.Matches(@"^rank  SKU +distance  verdict +matched  best catalogue photo$", lines[1]);
            int verdictColumn = lines[1].IndexOf("verdict", StringComparison.Ordinal);
            Assert.All(lines.Skip(3).Take(3), row => Assert.Equal(' ', row[verdictColumn - 1]));
            Assert.StartsWith("Answer: ", lines[6], StringComparison.Ordinal);
            Assert.Equal(MatchCaution.Text, lines[7]);
        }

        Assert.StartsWith("Verdicts: same photo ≤ ", blocks[2], StringComparison.Ordinal);
    }

    [Fact]
    public void Json_carries_the_settings_each_row_and_the_caution()
    {
        var (exitCode, output, error) = Run(ReferenceData.OpenCv("leuvenB.jpg"), "--index", index.Index, "--json", "--top", "2", "--crops", "none");

        Assert.Equal((0, ""), (exitCode, error));
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.Equal(MatchCaution.Text, root.GetProperty("caution").GetString());
        Assert.Equal("none", root.GetProperty("crops").GetString());
        Assert.Equal("default", root.GetProperty("thresholds").GetProperty("source").GetString());
        var rows = root.GetProperty("answers")[0].GetProperty("ranking").EnumerateArray().ToList();
        Assert.Equal(2, rows.Count);
        Assert.Equal(["rank", "sku", "distance", "wholePhotoDistance", "margin", "verdict", "photosMatched", "photosInSku", "bestPhoto"], rows[0].EnumerateObject().Select(p => p.Name));
        Assert.Equal("leuvenA", rows[0].GetProperty("sku").GetString());
        Assert.True(rows[0].GetProperty("distance").GetDouble() < rows[1].GetProperty("distance").GetDouble());
        Assert.Empty(root.GetProperty("failures").EnumerateArray());
    }

    [Fact]
    public void Csv_rows_neutralise_cells_that_could_start_a_formula_and_the_caution_goes_to_stderr()
    {
        var checkerboard = Path.Combine(index.Catalogue, MatchIndexFixture.FormulaSku, "checkerboard.png");

        var (exitCode, output, error) = Run(checkerboard, "--index", index.Index, "--csv", "--top", "1", "--crops", "none");

        Assert.Equal(0, exitCode);
        var lines = output.Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("query,rank,sku,distance,verdict,photos_matched,photos_in_sku,best_photo", lines[0]);
        Assert.Equal($"{checkerboard},1,'=SUM(A1),0,same file,1,1,'=SUM(A1)/checkerboard.png", lines[1]);
        Assert.Contains(MatchCaution.Text, error, StringComparison.Ordinal);
    }

    [Fact]
    public void Like_a_filed_photo_uses_its_stored_vector_and_leaves_the_photo_out()
    {
        // A model card that cannot load shows that no network is used.
        var (exitCode, likeOutput, error) = Run("--like", "graf1/graf1.png", "--index", index.Index, "--json", "--top", "4", "--model", "/no/such/card.json");
        var (_, fileOutput, _) = Run(ReferenceData.OpenCv("graf1.png"), "--index", index.Index, "--json", "--top", "5", "--crops", "none");

        Assert.True(exitCode == 0, error);
        using var like = JsonDocument.Parse(likeOutput);
        using var file = JsonDocument.Parse(fileOutput);
        var likeRows = Rows(like.RootElement.GetProperty("answers")[0]);
        var fileRows = Rows(file.RootElement.GetProperty("answers")[0]).Where(r => r.Sku != "graf1").ToList();
        Assert.Equal("photo graf1/graf1.png", like.RootElement.GetProperty("answers")[0].GetProperty("photos")[0].GetString());
        Assert.Equal(fileRows.Select(r => r.Sku), likeRows.Select(r => r.Sku));
        Assert.All(likeRows.Zip(fileRows), p => Assert.Equal(p.Second.Distance, p.First.Distance, 4));
    }

    [Fact]
    public void Like_a_SKU_leaves_out_every_photo_of_that_SKU()
    {
        var (exitCode, output, _) = Run("--like", "coffee", "--index", index.Index, "--top", "100", "--json");

        Assert.Equal(0, exitCode);
        using var json = JsonDocument.Parse(output);
        var answer = json.RootElement.GetProperty("answers")[0];
        Assert.Equal("SKU coffee (1 photo)", answer.GetProperty("photos")[0].GetString());
        Assert.DoesNotContain(Rows(answer), r => r.Sku == "coffee");
        Assert.Equal(MatchIndexFixture.Filed.Count, Rows(answer).Count); // every other SKU, the checkerboard's included
    }

    [Fact]
    public void Help_shows_examples_the_caution_and_the_exit_codes()
    {
        var (exitCode, output, _) = Run("--help");

        Assert.Equal(0, exitCode);
        Assert.Contains("lookup match snapshot.jpg --index parts.lookup", output, StringComparison.Ordinal);
        Assert.Contains("A visual match is not verification", output, StringComparison.Ordinal);
        Assert.Contains("Exit codes: 0 answered", output, StringComparison.Ordinal);
    }

    private static (int ExitCode, string Output, string Error) Run(params string[] args) => MatchIndexFixture.Run(["match", .. args]);

    private static int RankOf(JsonElement answer, string sku) =>
        Rows(answer).FindIndex(r => r.Sku == sku) is int i and >= 0 ? i : int.MaxValue;

    private static List<(string Sku, double Distance)> Rows(JsonElement answer) =>
        [.. answer.GetProperty("ranking").EnumerateArray().Select(r => (r.GetProperty("sku").GetString()!, r.GetProperty("distance").GetDouble()))];
}

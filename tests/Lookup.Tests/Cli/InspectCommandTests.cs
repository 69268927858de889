using System.CommandLine;
using System.Text.Json;
using Lookup.Cli;
using Lookup.Embedding;
using Lookup.Tests.Imaging;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Metadata.Profiles.Exif;

namespace Lookup.Tests.Cli;

/// <summary>Runs the real <c>lookup inspect</c> command in process, with its output captured.</summary>
public sealed class InspectCommandTests : IDisposable
{
    private readonly TestPhotos photos = new();

    [Fact]
    public void Inspect_with_json_reports_the_photo_and_the_model()
    {
        var path = ReferenceData.SkImage("rocket.jpg");

        var (exitCode, output, error) = Run("inspect", path, "--json");

        Assert.Equal(0, exitCode);
        Assert.Equal(string.Empty, error);
        using var report = JsonDocument.Parse(output);
        var root = report.RootElement;
        Assert.Equal(path, root.GetProperty("photo").GetString());
        Assert.Equal("JPEG", root.GetProperty("format").GetString());
        Assert.Equal(640, root.GetProperty("storedWidth").GetInt32());
        Assert.Equal(427, root.GetProperty("storedHeight").GetInt32());
        Assert.Equal(112525, root.GetProperty("fileBytes").GetInt64());
        Assert.Equal(1, root.GetProperty("orientation").GetInt32());
        Assert.Equal(512, root.GetProperty("dimension").GetInt32());
        Assert.True(root.GetProperty("norm").GetSingle() > 1);
        Assert.True(root.GetProperty("inferenceMs").GetDouble() > 0);
        Assert.Equal(ModelCard.DefaultName, root.GetProperty("model").GetString());
        Assert.Equal(ModelFingerprint.Compute(ModelCard.Default), root.GetProperty("fingerprint").GetString());
        Assert.Matches("^[0-9a-f]{16}$", root.GetProperty("differenceHash").GetString());
    }

    [Fact]
    public void Inspect_prints_an_aligned_table_naming_the_applied_orientation()
    {
        var path = photos.Write("tagged.jpg", ExifTagged(ReferenceData.SkImage("chelsea.png"), orientation: 6));

        var (exitCode, output, _) = Run("inspect", path);

        Assert.Equal(0, exitCode);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.All(lines, line => Assert.Equal(' ', line[12]));
        Assert.Contains("orientation  6 (rotated 90° clockwise on decode)", output, StringComparison.Ordinal);
        Assert.Contains("stored       451 × 300 px", output, StringComparison.Ordinal);
        Assert.Contains("upright      300 × 451 px", output, StringComparison.Ordinal);
        Assert.Contains("embedding    512 floats, norm ", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Inspect_of_a_truncated_photo_exits_1_with_the_file_and_reason_on_stderr_and_no_stack_trace()
    {
        // skimage/data/truncated.jpg (python3-skimage).
        var path = ReferenceData.SkImage("truncated.jpg");

        var (exitCode, output, error) = Run("inspect", path, "--json");

        Assert.Equal(1, exitCode);
        Assert.StartsWith($"lookup inspect: {path}: the JPEG data is truncated or damaged", error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
        using var report = JsonDocument.Parse(output);
        Assert.Equal("corrupt", report.RootElement.GetProperty("rejected").GetString());
    }

    [Fact]
    public void Inspect_without_a_photo_is_a_usage_error()
    {
        var (exitCode, _, error) = Run("inspect");

        Assert.Equal(2, exitCode);
        Assert.Contains("Required argument missing", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Inspect_with_an_unreadable_model_card_exits_1_naming_the_card()
    {
        var card = photos.Write("card.json", "{ \"name\": \"x\" }"u8.ToArray());

        var (exitCode, _, error) = Run("inspect", ReferenceData.SkImage("rocket.jpg"), "--model", card);

        Assert.Equal(1, exitCode);
        Assert.Contains(card, error, StringComparison.Ordinal);
    }

    [Fact]
    public void Inspect_help_shows_an_example_and_the_exit_codes()
    {
        var (exitCode, output, _) = Run("inspect", "--help");

        Assert.Equal(0, exitCode);
        Assert.Contains("lookup inspect photos/4471-B/front.jpg --json", output, StringComparison.Ordinal);
        Assert.Contains("Exit codes: 0 ok, 1 photo rejected or model not loadable", output, StringComparison.Ordinal);
    }

    public void Dispose() => photos.Dispose();

    private static (int ExitCode, string Output, string Error) Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var exitCode = Program.Run(args, new InvocationConfiguration { Output = output, Error = error });
        return (exitCode, output.ToString(), error.ToString());
    }

    private static byte[] ExifTagged(string path, ushort orientation)
    {
        using var image = Image.Load(path);
        image.Metadata.ExifProfile = new ExifProfile();
        image.Metadata.ExifProfile.SetValue(ExifTag.Orientation, orientation);
        using var stream = new MemoryStream();
        image.SaveAsJpeg(stream);
        return stream.ToArray();
    }
}

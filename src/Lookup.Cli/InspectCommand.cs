using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Lookup.Embedding;
using Lookup.Imaging;

namespace Lookup.Cli;

/// <summary><c>lookup inspect PHOTO</c>: decode one photo and embed it, showing what was found and how long each step took.</summary>
internal static class InspectCommand
{
    private static readonly JsonSerializerOptions Json = new() { PropertyNamingPolicy = JsonNamingPolicy.CamelCase, WriteIndented = true };

    public static Command Create()
    {
        var photo = new Argument<string>("photo") { Description = "The photo file to inspect (JPEG, PNG, GIF, TIFF, WebP or BMP)." };
        var json = new Option<bool>("--json") { Description = "Print one JSON object instead of the table." };
        var model = new Option<string?>("--model") { Description = "A model card (JSON) for another ONNX network; default: the built-in ResNet18." };
        var command = new Command(
            "inspect",
            """
            Decode one photo the way ingest does (limits, EXIF orientation, RGB), embed it, and show format, stored size,
            orientation, decode and inference times, embedding size and norm, and the model fingerprint.

            Example:
              lookup inspect photos/4471-B/front.jpg
              lookup inspect photos/4471-B/front.jpg --json

            Exit codes: 0 ok, 1 photo rejected or model not loadable (reason on stderr), 2 usage error.
            """)
        {
            photo,
            json,
            model,
        };
        command.SetAction(parseResult => Run(
            parseResult.GetValue(photo)!,
            parseResult.GetValue(json),
            parseResult.GetValue(model),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error));
        return command;
    }

    private static int Run(string path, bool json, string? modelCard, TextWriter output, TextWriter error)
    {
        ImageEmbedder embedder;
        try
        {
            embedder = ImageEmbedder.Load(modelCard is null ? ModelCard.Default : ModelCard.Load(modelCard));
        }
        catch (ModelLoadException e)
        {
            error.WriteLine($"lookup inspect: {e.Message}");
            return ExitCodes.Failures;
        }

        using (embedder)
        {
            var embedding = new float[embedder.Dimension];
            PhotoEmbedding result;
            try
            {
                result = new PhotoEmbedder(new PhotoDecoder(), embedder).Embed(path, embedding);
            }
            catch (PhotoRejectedException e)
            {
                error.WriteLine($"lookup inspect: {e.Message}");
                if (json)
                {
                    output.WriteLine(JsonSerializer.Serialize(new { photo = path, rejected = e.Reason.Code(), message = e.Message }, Json));
                }

                return ExitCodes.Failures;
            }

            var report = ToReport(path, result, embedder);
            if (json)
            {
                output.WriteLine(JsonSerializer.Serialize(report, Json));
            }
            else
            {
                WriteTable(report, embedder.InputSize, output);
            }

            return ExitCodes.Success;
        }
    }

    private static InspectReport ToReport(string path, PhotoEmbedding result, ImageEmbedder embedder)
    {
        var info = result.Info;
        return new InspectReport(
            path,
            info.Format.ToString().ToUpperInvariant(),
            info.StoredWidth,
            info.StoredHeight,
            info.FileBytes,
            info.FrameCount,
            info.Orientation,
            info.Width,
            info.Height,
            Math.Round(result.DecodeTime.TotalMilliseconds, 2),
            Math.Round(result.PrepareTime.TotalMilliseconds, 2),
            Math.Round(result.InferenceTime.TotalMilliseconds, 2),
            embedder.Dimension,
            result.Norm,
            DifferenceHash.ToHex(result.DifferenceHash),
            embedder.Card.Name,
            embedder.Fingerprint);
    }

    private static void WriteTable(InspectReport r, int inputSize, TextWriter output)
    {
        var frames = r.Frames == 1 ? "1 frame" : $"{r.Frames} frames (first decoded)";
        (string Label, string Value)[] rows =
        [
            ("photo", r.Photo),
            ("format", r.Format),
            ("stored", Invariant($"{r.StoredWidth} × {r.StoredHeight} px, {r.FileBytes:N0} bytes, {frames}")),
            ("orientation", Invariant($"{r.Orientation} ({DescribeOrientation(r.Orientation)})")),
            ("upright", Invariant($"{r.Width} × {r.Height} px")),
            ("decode", Invariant($"{r.DecodeMs:0.0} ms")),
            ("resize", Invariant($"{r.ResizeMs:0.0} ms (dHash, resize and crop to {inputSize} × {inputSize})")),
            ("inference", Invariant($"{r.InferenceMs:0.0} ms")),
            ("embedding", Invariant($"{r.Dimension} floats, norm {r.Norm:0.###} before normalisation")),
            ("dhash", r.DifferenceHash),
            ("model", r.Model),
            ("fingerprint", r.Fingerprint),
        ];
        var width = rows.Max(row => row.Label.Length) + 2;
        foreach (var (label, value) in rows)
        {
            output.WriteLine(label.PadRight(width) + value);
        }
    }

    private static string DescribeOrientation(int orientation) => orientation switch
    {
        2 => "mirrored left-right on decode",
        3 => "rotated 180° on decode",
        4 => "mirrored top-bottom on decode",
        5 => "rotated 90° clockwise and mirrored left-right on decode",
        6 => "rotated 90° clockwise on decode",
        7 => "rotated 90° clockwise and mirrored top-bottom on decode",
        8 => "rotated 90° anticlockwise on decode",
        _ => "stored upright",
    };

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

using Lookup.Imaging;
using Microsoft.ML.OnnxRuntime;

namespace Lookup.Embedding;

/// <summary>
/// Replaces a preprocessing model of the form f(x)[c] = x[source(c)] − M[c] (channel reorder, then a fixed
/// per-pixel mean image M) by our own tensor code. M is read by running the model once on zeros: f(0) = −M. A
/// probe input then checks the model has exactly that form, so a card cannot silently fold something else.
/// </summary>
internal static class MeanImageFolding
{
    private const float Tolerance = 1e-3f;

    public static float[] ReadMeanImage(ModelCard card, SessionOptions options)
    {
        var model = card.MeanImageModel!;
        if (!File.Exists(model.OnnxFile))
        {
            throw new ModelLoadException($"{model.OnnxFile}: the mean-image model named by card '{card.Name}' does not exist. Reinstall Lookup, or fix meanImageModel.onnxFile in the card.");
        }

        using var session = OnnxSessions.Open(model.OnnxFile, options);
        OnnxSessions.RequireName(session.InputMetadata.Keys, model.InputName, model.OnnxFile, "input");
        OnnxSessions.RequireName(session.OutputMetadata.Keys, model.OutputName, model.OnnxFile, "output");
        var size = card.InputSize;
        var length = 3 * size * size;
        long[] shape = [1, 3, size, size];

        var atZero = Run(session, model, new float[length], shape);
        // Values differ between planes at every pixel, so a wrong channel order cannot pass unnoticed.
        var planeLength = size * size;
        var probe = new float[length];
        for (var plane = 0; plane < 3; plane++)
        {
            for (var i = 0; i < planeLength; i++)
            {
                probe[(plane * planeLength) + i] = ((i * 37) + (plane * 85) + 1) % 256;
            }
        }

        var atProbe = Run(session, model, probe, shape);
        var worst = 0f;
        for (var plane = 0; plane < 3; plane++)
        {
            var source = card.ChannelOrder == ChannelOrder.Rgb ? plane : 2 - plane;
            for (var i = 0; i < planeLength; i++)
            {
                var folded = probe[(source * planeLength) + i] + atZero[(plane * planeLength) + i];
                worst = Math.Max(worst, Math.Abs(folded - atProbe[(plane * planeLength) + i]));
            }
        }

        if (worst > Tolerance)
        {
            throw new ModelLoadException(
                $"{model.OnnxFile}: this preprocessing model is not a {card.ChannelOrder.ToString().ToUpperInvariant()} reorder plus a fixed mean image " +
                $"(folded result differs by up to {worst:0.####}). Describe its preprocessing with scale, mean and std in the card instead.");
        }

        for (var i = 0; i < length; i++)
        {
            atZero[i] = -atZero[i];
        }

        return atZero;
    }

    private static float[] Run(InferenceSession session, MeanImageModel model, float[] input, long[] shape)
    {
        using var value = OrtValue.CreateTensorValueFromMemory(input, shape);
        using var results = session.Run(new RunOptions(), [model.InputName], [value], [model.OutputName]);
        var output = results[0].GetTensorDataAsSpan<float>();
        if (output.Length != input.Length)
        {
            throw new ModelLoadException($"{model.OnnxFile}: output '{model.OutputName}' has {output.Length} values; expected {input.Length} (3 × {shape[2]} × {shape[3]}). Check the card's inputSize.");
        }

        return output.ToArray();
    }
}

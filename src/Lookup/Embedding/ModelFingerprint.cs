using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using Lookup.Imaging;

namespace Lookup.Embedding;

/// <summary>
/// Identifies what produced an embedding: SHA-256 of the ONNX file(s) plus a canonical line-per-setting text of
/// the preprocessing, hashed again with SHA-256. Two embeddings are comparable only when fingerprints match. The
/// card's name is left out on purpose: renaming a card does not change a single vector.
/// </summary>
internal static class ModelFingerprint
{
    private const string Version = "lookup-model-1";

    /// <summary>Names the resize and crop the tensor code applies; change it whenever <see cref="TensorWriter"/> changes.</summary>
    private const string Geometry = "shorter-side-resize,centre-square,triangle";

    public static string Compute(ModelCard card) => Hex(SHA256.HashData(Encoding.UTF8.GetBytes(CanonicalText(card))));

    public static string CanonicalText(ModelCard card)
    {
        var text = new StringBuilder();
        text.Append(Version).Append('\n');
        text.Append("network=").Append(HashFile(card.OnnxFile)).Append('\n');
        text.Append("input=").Append(card.InputName).Append('\n');
        text.Append("output=").Append(card.OutputName).Append('\n');
        text.Append("size=").Append(card.InputSize.ToString(CultureInfo.InvariantCulture)).Append('\n');
        text.Append("geometry=").Append(Geometry).Append('\n');
        text.Append("order=").Append(card.ChannelOrder == ChannelOrder.Rgb ? "RGB" : "BGR").Append('\n');
        text.Append("scale=").Append(Number(card.Scale)).Append('\n');
        text.Append("mean=").Append(string.Join(',', card.Mean.Select(Number))).Append('\n');
        text.Append("std=").Append(string.Join(',', card.Std.Select(Number))).Append('\n');
        text.Append("mean-image=");
        if (card.MeanImageModel is { } meanModel)
        {
            text.Append(HashFile(meanModel.OnnxFile)).Append(',').Append(meanModel.InputName).Append(',').Append(meanModel.OutputName);
        }
        else
        {
            text.Append("none");
        }

        return text.Append('\n').ToString();
    }

    private static string HashFile(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16, FileOptions.SequentialScan);
        return Hex(SHA256.HashData(stream));
    }

    private static string Number(float value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static string Hex(byte[] hash) => Convert.ToHexStringLower(hash);
}

using Lookup.Imaging;
using Lookup.Tests.Imaging;
using Microsoft.ML.OnnxRuntime;

namespace Lookup.Tests.Embedding;

/// <summary>
/// The default card folds ResNetPreprocess.onnx (RGB → BGR, minus a per-pixel mean image; from the NuGet package
/// Microsoft.ML.DnnImageFeaturizer.ResNet18) into our tensor code. These checks run the package's own preprocessing
/// model on real photos and compare.
/// </summary>
[Collection(EmbedderCollection.Name)]
public sealed class FoldedPreprocessingTests(EmbedderFixture fixture)
{
    public static TheoryData<string> Photos() => ["opencv/graf1.png", "opencv/basketball1.png", "skimage/astronaut.png", "skimage/coffee.png"];

    [Theory]
    [MemberData(nameof(Photos))]
    public void Folded_tensor_equals_the_preprocessing_model_output_on_real_photos(string file)
    {
        var (folded, chained) = FoldedAndChained(file);

        var worst = folded.Zip(chained, (a, b) => Math.Abs(a - b)).Max();
        Assert.InRange(worst, 0f, 1e-3f);
    }

    [Theory]
    [MemberData(nameof(Photos))]
    public void Embedding_from_the_folded_tensor_equals_embedding_from_the_chained_models(string file)
    {
        var (folded, chained) = FoldedAndChained(file);
        var fromFolded = new float[fixture.Embedder.Dimension];
        var fromChained = new float[fixture.Embedder.Dimension];

        fixture.Embedder.Embed(folded, fromFolded);
        fixture.Embedder.Embed(chained, fromChained);

        Assert.InRange(ExactSearch.CosineDistance(fromFolded, fromChained), -1e-6, 1e-6);
    }

    private (float[] Folded, float[] Chained) FoldedAndChained(string file)
    {
        var card = fixture.Embedder.Card;
        using var photo = fixture.Decoder.Decode(Path.Combine(ReferenceData.Root, file));
        var raw = new float[fixture.Embedder.TensorLength];
        var folded = new float[fixture.Embedder.TensorLength];
        TensorWriter.WriteTensor(photo.Image, PixelNormalisation.Identity(card.InputSize), raw);
        TensorWriter.WriteTensor(photo.Image, fixture.Embedder.Normalisation, folded);

        using var session = new InferenceSession(card.MeanImageModel!.OnnxFile);
        using var input = OrtValue.CreateTensorValueFromMemory(raw, [1, 3, card.InputSize, card.InputSize]);
        using var results = session.Run(new RunOptions(), [card.MeanImageModel.InputName], [input], [card.MeanImageModel.OutputName]);
        return (folded, results[0].GetTensorDataAsSpan<float>().ToArray());
    }
}

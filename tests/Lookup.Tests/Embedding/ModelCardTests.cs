using Lookup.Embedding;
using Lookup.Imaging;
using Lookup.Tests.Imaging;

namespace Lookup.Tests.Embedding;

public sealed class ModelCardTests : IDisposable
{
    private readonly TestPhotos folder = new();

    [Fact]
    public void Default_names_the_model_files_copied_next_to_the_program()
    {
        var card = ModelCard.Default;

        Assert.Equal(ModelCard.DefaultName, card.Name);
        Assert.True(File.Exists(card.OnnxFile), card.OnnxFile);
        Assert.True(File.Exists(card.MeanImageModel!.OnnxFile), card.MeanImageModel.OnnxFile);
        Assert.StartsWith(Path.GetFullPath(AppContext.BaseDirectory), card.OnnxFile, StringComparison.Ordinal);
    }

    [Fact]
    public void Save_then_Load_gives_back_the_same_card()
    {
        var path = Path.Combine(folder.Directory, "resnet18.json");

        ModelCard.Default.Save(path);
        var loaded = ModelCard.Load(path);

        Assert.Equal(ModelCard.Default.ToJson(), loaded.ToJson());
        Assert.Contains("\"channelOrder\": \"BGR\"", File.ReadAllText(path), StringComparison.Ordinal);
    }

    [Fact]
    public void Load_resolves_relative_paths_against_the_card_folder_and_fills_defaults()
    {
        var path = Path.Combine(folder.Directory, "card.json");
        File.WriteAllText(path, """
            {
              // a user-brought network trained on 0-1 RGB input with per-channel statistics
              "name": "parts-net",
              "onnxFile": "models/parts.onnx",
              "inputName": "pixels",
              "outputName": "features",
              "scale": 0.003921569,
              "mean": [0.485, 0.456, 0.406],
              "std": [0.229, 0.224, 0.225],
            }
            """);

        var card = ModelCard.Load(path);

        Assert.Equal(Path.Combine(folder.Directory, "models", "parts.onnx"), card.OnnxFile);
        Assert.Equal(224, card.InputSize);
        Assert.Equal(ChannelOrder.Rgb, card.ChannelOrder);
        Assert.Null(card.MeanImageModel);
        Assert.Equal([0.229f, 0.224f, 0.225f], card.Std);
    }

    [Theory]
    [InlineData("""{ "name": "x", "onnxFile": "a.onnx", "inputName": "i", "outputName": "o", "inputSise": 300 }""", "inputSise")]
    [InlineData("""{ "name": "x", "onnxFile": "a.onnx", "inputName": "i" }""", "outputName")]
    [InlineData("""{ "name": "x", "onnxFile": "a.onnx", "inputName": "i", "outputName": "o", "mean": [1, 2] }""", "mean and std need 3 values")]
    [InlineData("""{ "name": "x", "onnxFile": "a.onnx", "inputName": "i", "outputName": "o", "std": [1, 0, 1] }""", "non-zero")]
    [InlineData("""{ "name": "x", "onnxFile": "a.onnx", "inputName": "i", "outputName": "o", "inputSize": 8 }""", "inputSize 8")]
    [InlineData("""{ "name": "x", "onnxFile": "a.onnx", "inputName": "i", "outputName": "o", "channelOrder": "GBR" }""", "channelOrder")]
    [InlineData("not json", "not a valid model card")]
    public void Load_names_the_card_file_and_the_problem(string json, string expected)
    {
        var path = Path.Combine(folder.Directory, "bad.json");
        File.WriteAllText(path, json);

        var error = Assert.Throws<ModelLoadException>(() => ModelCard.Load(path));

        Assert.StartsWith(path + ": ", error.Message, StringComparison.Ordinal);
        Assert.Contains(expected, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ImageEmbedder_Load_refuses_a_card_whose_model_file_is_missing()
    {
        var card = ModelCard.Default with { OnnxFile = Path.Combine(folder.Directory, "missing.onnx") };

        var error = Assert.Throws<ModelLoadException>(() => ImageEmbedder.Load(card));

        Assert.Contains("missing.onnx", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ImageEmbedder_Load_lists_the_model_inputs_when_the_card_names_another()
    {
        var card = ModelCard.Default with { InputName = "data" };

        var error = Assert.Throws<ModelLoadException>(() => ImageEmbedder.Load(card));

        Assert.Contains("'data'", error.Message, StringComparison.Ordinal);
        Assert.Contains("Input247", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ImageEmbedder_Load_refuses_a_mean_image_model_whose_channel_order_the_card_gets_wrong()
    {
        // ResNetPreprocess.onnx swaps RGB to BGR; a card claiming RGB would fold the wrong thing.
        var card = ModelCard.Default with { ChannelOrder = ChannelOrder.Rgb };

        var error = Assert.Throws<ModelLoadException>(() => ImageEmbedder.Load(card));

        Assert.Contains("not a RGB reorder plus a fixed mean image", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_card_with_per_channel_mean_instead_of_a_mean_image_loads_and_embeds()
    {
        // The default network described the way a user would describe another CNN: BGR, per-channel ImageNet means
        // in BGR order (103.94, 116.78, 123.68: common practice for Caffe-style networks, from memory).
        var card = ModelCard.Default with { Name = "resnet18-channel-mean", MeanImageModel = null, Mean = [103.94f, 116.78f, 123.68f] };
        using var embedder = ImageEmbedder.Load(card);
        using var photo = new PhotoDecoder().Decode(ReferenceData.SkImage("rocket.jpg"));
        var embedding = new float[embedder.Dimension];

        var norm = embedder.Embed(photo.Image, embedding);

        Assert.Equal(512, embedder.Dimension);
        Assert.True(norm > 0);
        Assert.False(embedder.Normalisation.HasMeanImage);
        Assert.NotEqual(ModelFingerprint.Compute(ModelCard.Default), embedder.Fingerprint);
    }

    public void Dispose() => folder.Dispose();
}

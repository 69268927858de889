namespace Lookup.Embedding;

/// <summary>
/// A small ONNX model that turns the RGB tensor into the network's input by reordering channels and subtracting a
/// fixed per-pixel image (the default ResNet18 ships one). Lookup runs it once, on zeros, at load and folds the
/// result into its own tensor code; a probe checks the model really is that simple.
/// </summary>
/// <param name="OnnxFile">Path of the ONNX file; relative paths in a card file are relative to the card.</param>
/// <param name="InputName">Input taking float[1, 3, size, size] RGB values.</param>
/// <param name="OutputName">Output in the card's channel order.</param>
public sealed record MeanImageModel(string OnnxFile, string InputName, string OutputName);

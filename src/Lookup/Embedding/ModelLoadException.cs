namespace Lookup.Embedding;

/// <summary>A model card or ONNX file that cannot be used; the message names the file and the fix.</summary>
public sealed class ModelLoadException : Exception
{
    /// <summary>Creates the exception.</summary>
    public ModelLoadException(string message, Exception? innerException = null)
        : base(message, innerException)
    {
    }
}

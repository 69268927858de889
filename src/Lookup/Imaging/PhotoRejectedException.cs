namespace Lookup.Imaging;

/// <summary>
/// A photo that cannot be used, with the file, the reason and what to do in the message. Every failure of
/// <see cref="PhotoDecoder"/> is one of these; decoder exceptions never escape.
/// </summary>
public sealed class PhotoRejectedException : Exception
{
    /// <summary>Creates a rejection for <paramref name="path"/>.</summary>
    public PhotoRejectedException(string path, PhotoRejectionReason reason, string message, Exception? innerException = null)
        : base(message, innerException)
    {
        Path = path;
        Reason = reason;
    }

    /// <summary>The file that was rejected, as given by the caller.</summary>
    public string Path { get; }

    /// <summary>Why it was rejected.</summary>
    public PhotoRejectionReason Reason { get; }
}

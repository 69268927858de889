namespace Lookup.Imaging;

/// <summary>Why a photo could not be turned into pixels.</summary>
public enum PhotoRejectionReason
{
    /// <summary>The file has no bytes.</summary>
    EmptyFile,

    /// <summary>The bytes are not a JPEG, PNG, GIF, TIFF, WebP or BMP image.</summary>
    UnknownFormat,

    /// <summary>The file is cut short or its image data is damaged.</summary>
    Corrupt,

    /// <summary>The header declares more pixels than the limit allows.</summary>
    TooManyPixels,

    /// <summary>The file is larger than the file-size limit.</summary>
    FileTooLarge,

    /// <summary>The file declares more frames or pages than the limit allows.</summary>
    TooManyFrames,

    /// <summary>A known format using a feature the decoder does not support (for example animated WebP).</summary>
    Unsupported,

    /// <summary>The file could not be read: missing, no permission, or an I/O error.</summary>
    Unreadable,

    /// <summary>Decoding took longer than the time limit.</summary>
    TimedOut,
}

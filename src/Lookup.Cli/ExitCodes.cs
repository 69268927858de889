namespace Lookup.Cli;

/// <summary>Process exit codes shared by every command; documented in each command's help.</summary>
internal static class ExitCodes
{
    /// <summary>The command did its job.</summary>
    public const int Ok = 0;

    /// <summary>A photo could not be used (empty, not an image, truncated, over a limit, unreadable).</summary>
    public const int PhotoRejected = 1;

    /// <summary>The command line was wrong: unknown command or option, missing argument.</summary>
    public const int Usage = 2;

    /// <summary>The model card or ONNX model could not be loaded.</summary>
    public const int ModelUnusable = 3;
}

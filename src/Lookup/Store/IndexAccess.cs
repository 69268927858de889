namespace Lookup.Store;

/// <summary>How an <see cref="IndexFile"/> is opened.</summary>
public enum IndexAccess
{
    /// <summary>Read-only snapshot; any number of readers, also while a writer is active.</summary>
    Read,

    /// <summary>The single writer: creates the file if missing, takes the writer lock.</summary>
    Write,
}

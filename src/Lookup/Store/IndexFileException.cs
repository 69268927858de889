namespace Lookup.Store;

/// <summary>An index file that cannot be opened or used, with a message naming the file, the numbers and the fix.</summary>
public sealed class IndexFileException : Exception
{
    /// <summary>Creates the exception.</summary>
    public IndexFileException(string path, IndexFileProblem problem, string message, Exception? inner = null)
        : base(message, inner)
    {
        Path = path;
        Problem = problem;
    }

    /// <summary>The index file concerned.</summary>
    public string Path { get; }

    /// <summary>What is wrong.</summary>
    public IndexFileProblem Problem { get; }

    /// <summary>Who holds the writer lock, when <see cref="Problem"/> is <see cref="IndexFileProblem.WriterActive"/> and that is known.</summary>
    public WriterInfo? Holder { get; init; }
}

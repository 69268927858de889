namespace Lookup.Store;

/// <summary>
/// Tells the writer whether readers are open, through <c>&lt;index&gt;.readers</c>: each reader holds it open for
/// reading with FileShare.ReadWrite (a shared advisory flock on Unix) for its whole life; the writer checks for
/// readers by trying FileShare.None (an exclusive flock) without waiting. The writer needs this before a
/// checkpoint, which rewrites data pages and empties the journal that open readers still read from.
/// </summary>
internal static class ReaderRegistry
{
    public static string PathFor(string indexPath) => indexPath + ".readers";

    /// <summary>
    /// Registers a reader, waiting up to <paramref name="wait"/> while a writer is checkpointing. Returns null when the
    /// registry cannot be created or opened for lack of permission (an index in a folder this user may not write):
    /// such a reader runs unregistered. Only a writer running as another user, with write access there, could then
    /// checkpoint under it; that rare setup is accepted rather than refusing to read a read-only index.
    /// </summary>
    public static FileStream? Enter(string indexPath, TimeSpan wait)
    {
        var deadline = DateTime.UtcNow + wait;
        while (true)
        {
            try
            {
                return new FileStream(PathFor(indexPath), FileMode.OpenOrCreate, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete);
            }
            catch (UnauthorizedAccessException)
            {
                return null;
            }
            catch (IOException) when (DateTime.UtcNow < deadline)
            {
                Thread.Sleep(50);
            }
            catch (IOException error)
            {
                throw new IndexFileException(
                    indexPath,
                    IndexFileProblem.WriterActive,
                    $"{indexPath}: the writer has been tidying the journal for over {wait.TotalSeconds:F0} s; try again in a moment.",
                    error);
            }
        }
    }

    /// <summary>Exclusive hold proving no reader is open, or null when at least one is.</summary>
    public static FileStream? TryExclusive(string indexPath)
    {
        try
        {
            return new FileStream(PathFor(indexPath), FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
        }
        catch (IOException)
        {
            return null;
        }
    }
}

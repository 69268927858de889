using System.Text;

namespace Lookup.Store;

/// <summary>
/// The single-writer lock of an index: <c>&lt;index&gt;.lock</c> held open with FileShare.None (an exclusive
/// advisory flock on Unix, a share-mode lock on Windows) and holding a <see cref="WriterInfo"/>. The operating
/// system drops the lock when the process ends in any way, kill -9 included, so a lock file left behind by a dead
/// writer never blocks: the next writer takes the lock and overwrites the text.
/// </summary>
internal sealed class WriterLock : IDisposable
{
    private readonly FileStream _stream;

    private WriterLock(FileStream stream, string path)
    {
        _stream = stream;
        Path = path;
    }

    public string Path { get; }

    public static string PathFor(string indexPath) => indexPath + ".lock";

    /// <summary>Takes the lock or throws <see cref="IndexFileException"/> naming the holder.</summary>
    public static WriterLock Acquire(string indexPath)
    {
        string path = PathFor(indexPath);
        FileStream stream;
        try
        {
            stream = new FileStream(path, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
        }
        catch (IOException error) when (File.Exists(path))
        {
            var holder = ReadHolder(indexPath);
            string who = holder is null ? "another process (its lock file could not be read)" : holder.ToString();
            throw new IndexFileException(
                indexPath,
                IndexFileProblem.WriterActive,
                $"{indexPath} is being written by {who}. Only one writer at a time: wait for it to finish, or stop it. Reading (match, sweep) works meanwhile.",
                error)
            {
                Holder = holder,
            };
        }

        var bytes = Encoding.UTF8.GetBytes(WriterInfo.Current().Format());
        stream.SetLength(0);
        stream.Write(bytes);
        stream.Flush(flushToDisk: true);
        return new WriterLock(stream, path);
    }

    /// <summary>The current holder, read without taking the lock; null when none is recorded or it cannot be read.</summary>
    public static WriterInfo? ReadHolder(string indexPath)
    {
        string? text = LockedFileText.TryRead(PathFor(indexPath));
        return text is null ? null : WriterInfo.Parse(text);
    }

    /// <summary>Releases the lock and empties the file (so a stale copy never names a finished writer).</summary>
    public void Dispose()
    {
        try
        {
            _stream.SetLength(0);
        }
        finally
        {
            _stream.Dispose();
        }
    }
}

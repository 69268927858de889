using LiteDB;
using LiteDB.Engine;

namespace Lookup.Store;

/// <summary>
/// The one owner of the LiteDB database inside a <c>*.lookup</c> file; every collection (graph, photos, sweeps,
/// decisions) goes through <see cref="Database"/>.
/// <para>
/// Concurrency design (LiteDB 5.0.21, tested on Linux). LiteDB's direct mode journals every committed page
/// into <c>&lt;name&gt;-log&lt;ext&gt;</c> and, by default, copies the journal into the data file ("checkpoint")
/// every 1000 pages and on close. A checkpoint rewrites data pages and truncates the journal under any other
/// process that has the file open, and LiteDB's shared mode instead reopens the whole engine around every single
/// call behind a global mutex (far too slow for a graph walk that reads thousands of nodes). So:
/// </para>
/// <list type="bullet">
/// <item>The file's CHECKPOINT pragma is 0: LiteDB never checkpoints on its own. While a writer is open the data
/// file is not touched and the journal only grows by appending, so a reader's view stays valid.</item>
/// <item>One writer: <see cref="WriterLock"/> (<c>&lt;index&gt;.lock</c>, exclusive, names its holder).</item>
/// <item>Readers open data file and journal as read-only streams (no LiteDB file factory, which would delete an
/// empty journal on close under a live writer) and see a snapshot: every transaction committed before they
/// opened, nothing after. Each reader holds <c>&lt;index&gt;.readers</c> shared for its life.</item>
/// <item>The writer checkpoints only when it can hold <c>&lt;index&gt;.readers</c> exclusively, i.e. no reader is
/// open: on open, after a commit once the journal passes <see cref="CheckpointThresholdBytes"/>, and on close.
/// With readers present it skips, and the journal grows until a later chance.</item>
/// <item>Crash safety is LiteDB's journal: a transaction is in the file entirely or not at all, and a killed
/// writer's partial transaction is ignored on the next open.</item>
/// </list>
/// <para>Thread safety: LiteDatabase is thread-safe; transactions are per thread. Dispose once, after all use.</para>
/// </summary>
public sealed partial class IndexFile : IDisposable
{
    /// <summary>The schema this build writes and the newest it reads.</summary>
    public const int CurrentSchemaVersion = 1;

    /// <summary>Journal size after which a commit tries to checkpoint (when no reader is open).</summary>
    public const long CheckpointThresholdBytes = 64L << 20;

    private const string MetaCollection = "lookup_meta";
    private const string SchemaId = "schema";

    private readonly WriterLock? _writerLock;

    /// <summary>The journal size that triggers a checkpoint attempt; lowered only by the crash test to checkpoint often.</summary>
    internal static long CheckpointThreshold { get; set; } = CheckpointThresholdBytes;

    private readonly FileStream? _readerHold;
    private readonly Stream? _dataStream;
    private readonly Stream? _logStream;
    private bool _disposed;

    // Set when the storage failed under a commit (disk full, I/O error): LiteDB may still hold the failed
    // transaction's locks, and a checkpoint would only fail again and hide the first error. The journal keeps
    // every transaction committed before the failure; the next writer copies it in.
    private bool _faulted;

    private IndexFile(string path, IndexAccess access, LiteDatabase database, WriterLock? writerLock, FileStream? readerHold, Stream? dataStream, Stream? logStream)
    {
        Path = path;
        Access = access;
        Database = database;
        _writerLock = writerLock;
        _readerHold = readerHold;
        _dataStream = dataStream;
        _logStream = logStream;
    }

    /// <summary>Full path of the index file.</summary>
    public string Path { get; }

    /// <summary>How this handle was opened.</summary>
    public IndexAccess Access { get; }

    /// <summary>True for the writer.</summary>
    public bool IsWritable => Access == IndexAccess.Write;

    /// <summary>The schema version recorded in the file.</summary>
    public int SchemaVersion { get; private set; }

    /// <summary>The database. Readers must not write to it.</summary>
    internal LiteDatabase Database { get; }

    /// <summary>The journal file LiteDB keeps beside <paramref name="indexPath"/> (parts.lookup → parts-log.lookup).</summary>
    public static string JournalPathFor(string indexPath) =>
        System.IO.Path.Combine(
            System.IO.Path.GetDirectoryName(indexPath) ?? "",
            System.IO.Path.GetFileNameWithoutExtension(indexPath) + "-log" + System.IO.Path.GetExtension(indexPath));

    /// <summary>
    /// Runs <paramref name="work"/> in one transaction, joining the caller's if one is already open on this thread;
    /// afterwards (writer, outermost transaction) checkpoints when the journal is large and no reader is open.
    /// </summary>
    public void InTransaction(Action work)
    {
        ArgumentNullException.ThrowIfNull(work);
        RequireWritable();
        bool own = Database.BeginTrans();
        try
        {
            work();
            if (own)
            {
                Database.Commit();
            }
        }
        catch (Exception error)
        {
            bool storage = IsStorageFailure(error);
            _faulted |= storage;
            if (own)
            {
                try
                {
                    Database.Rollback();
                }
                catch (Exception rollbackError) when (_faulted || IsStorageFailure(rollbackError))
                {
                    // Rolling back writes to the journal too; on a full disk it fails as well. The pages of an
                    // unfinished transaction are never marked confirmed, so the next open ignores them.
                    _faulted = true;
                }
            }

            if (storage)
            {
                throw new IndexFileException(
                    Path,
                    IndexFileProblem.WriteFailed,
                    $"writing {Path} failed: {error.Message} Every transaction committed before the failure is kept and this one " +
                    "was rolled back. Free disk space (or fix what the message names) and run the same command again: it carries on " +
                    "where this run stopped.",
                    error);
            }

            throw;
        }

        if (own && JournalLength() > CheckpointThreshold)
        {
            TryCheckpoint();
        }
    }

    /// <summary>Copies the journal into the data file if no reader is open; returns whether it did.</summary>
    public bool TryCheckpoint()
    {
        RequireWritable();
        return CheckpointIfNoReaders();
    }

    private bool CheckpointIfNoReaders()
    {
        using var exclusive = ReaderRegistry.TryExclusive(Path);
        if (exclusive is null)
        {
            return false;
        }

        Database.Checkpoint();
        return true;
    }

    /// <summary>Bytes in the journal now.</summary>
    public long JournalLength()
    {
        var info = new FileInfo(JournalPathFor(Path));
        return info.Exists ? info.Length : 0;
    }

    /// <summary>Closes the database (the writer checkpoints first when no reader is open) and releases the locks.</summary>
    public void Dispose()
    {
        if (_disposed)
        {
            return;
        }

        try
        {
            if (IsWritable && !_faulted)
            {
                CheckpointIfNoReaders();
            }
        }
        finally
        {
            _disposed = true;
            CloseDatabase();
            _dataStream?.Dispose();
            _logStream?.Dispose();
            _readerHold?.Dispose();
            _writerLock?.Dispose();
        }
    }

    private void CloseDatabase()
    {
        try
        {
            Database.Dispose();
        }
        catch (Exception) when (_faulted)
        {
            // The storage already failed and LiteDB may still hold the failed transaction's locks; the error that
            // matters has been thrown to the caller.
        }
    }

    /// <summary>
    /// A write the operating system refused: an I/O error (ENOSPC "No space left on device", EIO, ...), or EFBIG (a
    /// file-size limit, e.g. 4 GiB on FAT32), which .NET reports as an ArgumentOutOfRangeException from RandomAccess.
    /// </summary>
    internal static bool IsStorageFailure(Exception e) =>
        e is IOException
        || (e is ArgumentOutOfRangeException && e.TargetSite?.DeclaringType?.FullName == "System.IO.RandomAccess");

    internal void RequireWritable()
    {
        ObjectDisposedException.ThrowIf(_disposed, this);
        if (!IsWritable)
        {
            throw new InvalidOperationException($"{Path} was opened for reading; open it with IndexAccess.Write to change it.");
        }
    }

    private static LiteDatabase OpenEngine(string path, Stream? data, Stream? log, bool readOnly)
    {
        var settings = data is null
            ? new EngineSettings { Filename = path }
            : new EngineSettings { DataStream = data, LogStream = log, ReadOnly = readOnly };
        return new LiteDatabase(new LiteEngine(settings));
    }
}

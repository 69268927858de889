using System.Text;
using LiteDB;

namespace Lookup.Store;

/// <summary>Opening, creating and validating index files.</summary>
public sealed partial class IndexFile
{
    // LiteDB 5 writes this text at offset 32 of the first page of every data file.
    private static readonly byte[] LiteDbMagic = Encoding.ASCII.GetBytes("** This is a LiteDB file **");

    // LiteDB 5's header page keeps the id of the last page in use at offset 64 (uint32, little-endian); pages are 8 KiB.
    private const int LastPageIdOffset = 64;
    private const int PageSize = 8192;

    /// <summary>
    /// Opens <paramref name="path"/>. <see cref="IndexAccess.Write"/> creates the file when missing and takes the
    /// writer lock; <see cref="IndexAccess.Read"/> opens a read-only snapshot and may run beside the writer.
    /// </summary>
    /// <exception cref="IndexFileException">Missing (read), not an index, damaged, newer schema, or another writer active.</exception>
    public static IndexFile Open(string path, IndexAccess access, TimeSpan? readerWait = null)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        string full = System.IO.Path.GetFullPath(path);
        return access == IndexAccess.Write ? OpenWriter(full) : OpenReader(full, readerWait ?? TimeSpan.FromSeconds(30));
    }

    private static IndexFile OpenWriter(string path)
    {
        WriterLock writerLock;
        try
        {
            writerLock = WriterLock.Acquire(path);
        }
        catch (UnauthorizedAccessException error)
        {
            throw ReadOnly(path, WriterLock.PathFor(path), error);
        }

        LiteDatabase? database = null;
        try
        {
            // A writer killed between creating the file and writing its first page leaves it empty; LiteDB starts a
            // zero-length file afresh, so adopt it rather than refuse it as truncated.
            bool isNew = !File.Exists(path) || new FileInfo(path).Length == 0;
            if (!isNew)
            {
                CheckLooksLikeLiteDb(path);
            }

            database = Wrap(path, () => OpenEngine(path, null, null, readOnly: false));
            var file = new IndexFile(path, IndexAccess.Write, database, writerLock, null, null, null);
            database.CheckpointSize = 0;

            // A writer killed between creating the file and its first commit leaves an empty LiteDB file: adopt it.
            if (isNew || !database.GetCollectionNames().Any())
            {
                file.WriteSchema();
            }
            else
            {
                file.ReadSchema();
            }

            file.TryCheckpoint();
            return file;
        }
        catch (UnauthorizedAccessException error)
        {
            DisposeQuietly(database);
            writerLock.Dispose();
            throw ReadOnly(path, path, error);
        }
        catch
        {
            DisposeQuietly(database);
            writerLock.Dispose();
            throw;
        }
    }

    /// <summary>A writer refused by file modes: ingest and the other writing commands cannot run, reading ones can.</summary>
    private static IndexFileException ReadOnly(string path, string refused, Exception error) =>
        new(path, IndexFileProblem.AccessDenied,
            $"{path} cannot be written: access to {refused} was denied ({error.Message}). Writing (ingest, merge, calibrate, dismiss, " +
            $"check --repair, storing a sweep) needs write access to the index file and its folder (for {System.IO.Path.GetFileName(JournalPathFor(path))} " +
            "and the .lock file); match, status and check only read. Run as the index's owner or make it writable.",
            error);

    private static void DisposeQuietly(LiteDatabase? database)
    {
        try
        {
            database?.Dispose();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or LiteException)
        {
            // Closing a database that failed to open; the original error is the one to report.
        }
    }

    private static IndexFile OpenReader(string path, TimeSpan wait)
    {
        if (!File.Exists(path))
        {
            throw new IndexFileException(path, IndexFileProblem.NotFound, $"{path} does not exist: build it first with ingest, or check the --index path.");
        }

        CheckLooksLikeLiteDb(path);
        var hold = ReaderRegistry.Enter(path, wait);
        try
        {
            return OpenReader(path, hold);
        }
        catch (UnauthorizedAccessException error)
        {
            hold?.Dispose();
            throw new IndexFileException(path, IndexFileProblem.AccessDenied,
                $"{path} cannot be read: access was denied ({error.Message}). Run as a user who may read the index file (and its -log journal), or change its permissions.", error);
        }
    }

    private static IndexFile OpenReader(string path, FileStream? hold)
    {
        Stream? data = null;
        Stream? log = null;
        LiteDatabase? database = null;
        try
        {
            data = new PageAlignedReadStream(new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete), PageSize);
            string journal = JournalPathFor(path);
            log = File.Exists(journal)
                ? new PageAlignedReadStream(new FileStream(journal, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete), PageSize)
                : new MemoryStream();
            var opened = Wrap(path, () => OpenEngine(path, data, log, readOnly: true));
            database = opened;
            var file = new IndexFile(path, IndexAccess.Read, opened, null, hold, data, log);
            file.ReadSchema();
            return file;
        }
        catch
        {
            database?.Dispose();
            data?.Dispose();
            log?.Dispose();
            hold?.Dispose();
            throw;
        }
    }

    private void WriteSchema()
    {
        Database.GetCollection(MetaCollection).Upsert(new BsonDocument
        {
            ["_id"] = SchemaId,
            ["version"] = CurrentSchemaVersion,
            ["created"] = DateTime.UtcNow,
            ["application"] = "Lookup",
        });
        SchemaVersion = CurrentSchemaVersion;
    }

    private void ReadSchema()
    {
        BsonDocument? schema;
        try
        {
            schema = Database.CollectionExists(MetaCollection) ? Database.GetCollection(MetaCollection).FindById(SchemaId) : null;
        }
        catch (LiteException error)
        {
            throw Damaged(Path, error);
        }

        if (schema is null || !schema["version"].IsInt32)
        {
            throw new IndexFileException(Path, IndexFileProblem.NotAnIndex, $"{Path} is a LiteDB file but not a Lookup index (no schema record). Point --index at a .lookup file made by ingest.");
        }

        SchemaVersion = schema["version"].AsInt32;
        if (SchemaVersion > CurrentSchemaVersion)
        {
            throw new IndexFileException(Path, IndexFileProblem.NewerSchema, $"{Path} uses index schema {SchemaVersion}; this Lookup reads schema {CurrentSchemaVersion} and older. Update Lookup to open it.");
        }
    }

    private static void CheckLooksLikeLiteDb(string path)
    {
        var head = new byte[8192];
        int read;
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete);
            read = stream.ReadAtLeast(head, head.Length, throwOnEndOfStream: false);
        }
        catch (IOException error)
        {
            throw new IndexFileException(path, IndexFileProblem.NotAnIndex, $"{path} cannot be read: {error.Message}", error);
        }
        catch (UnauthorizedAccessException error)
        {
            throw new IndexFileException(path, IndexFileProblem.AccessDenied,
                $"{path} cannot be read: access was denied ({error.Message}). Run as a user who may read the index file, or change its permissions.", error);
        }

        if (read == head.Length && head.AsSpan(32, LiteDbMagic.Length).SequenceEqual(LiteDbMagic))
        {
            CheckNotTruncated(path, head);
            return;
        }

        {
            throw new IndexFileException(
                path,
                IndexFileProblem.NotAnIndex,
                read < head.Length
                    ? $"{path} is {read} bytes long, shorter than one LiteDB page (8192): it is truncated or not an index. Restore it from a backup or rebuild it with ingest."
                    : $"{path} is not a Lookup index (no LiteDB header). Point --index at a .lookup file made by ingest.");
        }
    }

    /// <summary>
    /// Refuses a data file shorter than the pages its header counts. Only when the journal is empty: a journal still
    /// to be copied in (a writer stopped before its checkpoint) may legitimately hold pages the data file has not got.
    /// LiteDB itself would open such a file and fail later, deep inside a read, with messages that name no file.
    /// </summary>
    private static void CheckNotTruncated(string path, byte[] header)
    {
        var journal = new FileInfo(JournalPathFor(path));
        if (journal.Exists && journal.Length > 0)
        {
            return;
        }

        long pages = (long)System.Buffers.Binary.BinaryPrimitives.ReadUInt32LittleEndian(header.AsSpan(LastPageIdOffset)) + 1;
        long length = new FileInfo(path).Length;
        if (length < pages * PageSize)
        {
            throw new IndexFileException(
                path,
                IndexFileProblem.NotAnIndex,
                $"{path} is truncated: it is {length:N0} bytes long but its header counts {pages:N0} pages of {PageSize} bytes ({pages * PageSize:N0} bytes); " +
                "a copy was cut short or the disk filled up while copying. Restore it from a backup, or ingest the catalogue into a new index file.");
        }
    }

    private static LiteDatabase Wrap(string path, Func<LiteDatabase> open)
    {
        try
        {
            return open();
        }
        catch (Exception error) when (error is LiteException or IOException or InvalidCastException or ArgumentException or IndexOutOfRangeException or OverflowException or NotSupportedException)
        {
            throw Damaged(path, error);
        }
    }

    private static IndexFileException Damaged(string path, Exception error) =>
        new(path, IndexFileProblem.NotAnIndex, $"{path} could not be opened as an index ({error.Message}). It may be damaged: restore it from a backup or rebuild it with ingest.", error);
}

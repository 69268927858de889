using LiteDB;
using Lookup.Store;

namespace Lookup.Tests.Store;

public sealed class IndexFileTests
{
    [Fact]
    public void Open_for_write_creates_a_file_with_the_current_schema()
    {
        using var temp = new TempIndex();
        using (var file = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            Assert.Equal(IndexFile.CurrentSchemaVersion, file.SchemaVersion);
        }

        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);
        Assert.Equal(IndexFile.CurrentSchemaVersion, reader.SchemaVersion);
        Assert.False(reader.IsWritable);
    }

    [Fact]
    public void Open_for_read_of_a_missing_file_names_the_path()
    {
        using var temp = new TempIndex();
        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, IndexAccess.Read));
        Assert.Equal(IndexFileProblem.NotFound, error.Problem);
        Assert.Contains(temp.Path, error.Message);
    }

    [Theory]
    [InlineData(IndexAccess.Read)]
    [InlineData(IndexAccess.Write)]
    public void Open_refuses_a_file_that_is_not_a_LiteDB_file(IndexAccess access)
    {
        using var temp = new TempIndex();
        var bytes = new byte[20_000];
        new Random(1).NextBytes(bytes);
        File.WriteAllBytes(temp.Path, bytes);

        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, access));
        Assert.Equal(IndexFileProblem.NotAnIndex, error.Problem);
        Assert.Contains("not a Lookup index", error.Message);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(100)]
    [InlineData(8191)]
    public void Open_refuses_a_file_truncated_inside_the_first_page(int length)
    {
        using var temp = new TempIndex();
        CreateIndexWithData(temp.Path);
        using (var stream = File.OpenWrite(temp.Path))
        {
            stream.SetLength(length);
        }

        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, IndexAccess.Read));
        Assert.Equal(IndexFileProblem.NotAnIndex, error.Problem);
        Assert.Contains($"{length} bytes long", error.Message);
    }

    [Fact]
    public void Open_refuses_a_file_truncated_after_the_header_page_with_a_typed_error()
    {
        using var temp = new TempIndex();
        CreateIndexWithData(temp.Path);
        using (var stream = File.OpenWrite(temp.Path))
        {
            stream.SetLength(8192);
        }

        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, IndexAccess.Read));
        Assert.Equal(IndexFileProblem.NotAnIndex, error.Problem);
        Assert.Contains(temp.Path, error.Message);
    }

    [Fact]
    public void Open_refuses_a_LiteDB_file_without_lookup_metadata()
    {
        using var temp = new TempIndex();
        using (var db = new LiteDatabase(temp.Path))
        {
            db.GetCollection("other").Insert(new BsonDocument { ["x"] = 1 });
        }

        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, IndexAccess.Read));
        Assert.Equal(IndexFileProblem.NotAnIndex, error.Problem);
        Assert.Contains("not a Lookup index", error.Message);
    }

    [Fact]
    public void Open_refuses_a_newer_schema_and_says_to_update()
    {
        using var temp = new TempIndex();
        using (var file = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            file.Database.GetCollection("lookup_meta").Upsert(new BsonDocument { ["_id"] = "schema", ["version"] = 99 });
        }

        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, IndexAccess.Read));
        Assert.Equal(IndexFileProblem.NewerSchema, error.Problem);
        Assert.Contains("schema 99", error.Message);
        Assert.Contains("Update Lookup", error.Message);
    }

    [Fact]
    public void A_second_writer_is_refused_naming_the_holder()
    {
        using var temp = new TempIndex();
        using var first = IndexFile.Open(temp.Path, IndexAccess.Write);

        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, IndexAccess.Write));

        Assert.Equal(IndexFileProblem.WriterActive, error.Problem);
        Assert.NotNull(error.Holder);
        Assert.Equal(Environment.ProcessId, error.Holder.ProcessId);
        Assert.Equal(Environment.MachineName, error.Holder.Host);
        Assert.Contains($"pid {Environment.ProcessId} on {Environment.MachineName}", error.Message);
    }

    [Fact]
    public void A_lock_file_left_by_a_dead_writer_does_not_block_the_next_one()
    {
        using var temp = new TempIndex();
        using (IndexFile.Open(temp.Path, IndexAccess.Write))
        {
        }

        // What a killed writer leaves: the lock file with its text, but no process holding the lock.
        File.WriteAllText(temp.Path + ".lock", new WriterInfo(999_999, "gone-host", "lookup ingest", DateTimeOffset.UtcNow.AddHours(-3)).Format());

        using var writer = IndexFile.Open(temp.Path, IndexAccess.Write);
        Assert.True(writer.IsWritable);
        Assert.Equal(Environment.ProcessId, WriterLock.ReadHolder(temp.Path)?.ProcessId);
    }

    [Fact]
    public void The_writer_lock_is_released_on_dispose()
    {
        using var temp = new TempIndex();
        IndexFile.Open(temp.Path, IndexAccess.Write).Dispose();
        using var again = IndexFile.Open(temp.Path, IndexAccess.Write);
        Assert.True(again.IsWritable);
    }

    [Fact]
    public void A_reader_opens_while_the_writer_is_active_and_sees_the_commits_made_before_it_opened()
    {
        using var temp = new TempIndex();
        using var writer = IndexFile.Open(temp.Path, IndexAccess.Write);
        writer.InTransaction(() => writer.Database.GetCollection("photos").Insert(new BsonDocument { ["_id"] = 1 }));

        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);
        writer.InTransaction(() => writer.Database.GetCollection("photos").Insert(new BsonDocument { ["_id"] = 2 }));

        Assert.Equal([1], reader.Database.GetCollection("photos").FindAll().Select(d => d["_id"].AsInt32));
        using var later = IndexFile.Open(temp.Path, IndexAccess.Read);
        Assert.Equal([1, 2], later.Database.GetCollection("photos").FindAll().Select(d => d["_id"].AsInt32).Order());
    }

    [Fact]
    public void The_writer_does_not_checkpoint_under_an_open_reader_and_does_once_readers_are_gone()
    {
        using var temp = new TempIndex();
        var writer = IndexFile.Open(temp.Path, IndexAccess.Write);
        writer.InTransaction(() => writer.Database.GetCollection("photos").Insert(new BsonDocument { ["_id"] = 1, ["p"] = new byte[5000] }));
        using (var reader = IndexFile.Open(temp.Path, IndexAccess.Read))
        {
            Assert.False(writer.TryCheckpoint());
            writer.Dispose();
            Assert.True(File.Exists(IndexFile.JournalPathFor(temp.Path)));
            Assert.Single(reader.Database.GetCollection("photos").FindAll());
        }

        using (var writer2 = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            Assert.Equal(0, writer2.JournalLength());
        }

        using var last = IndexFile.Open(temp.Path, IndexAccess.Read);
        Assert.Single(last.Database.GetCollection("photos").FindAll());
    }

    [Fact]
    public void A_reader_opens_a_journal_that_ends_in_a_partial_page_and_sees_every_whole_commit()
    {
        using var temp = new TempIndex();
        using var writer = IndexFile.Open(temp.Path, IndexAccess.Write);
        writer.InTransaction(() => writer.Database.GetCollection("photos").Insert(new BsonDocument { ["_id"] = 1 }));
        // What a write cut short by a full disk leaves: part of a page after the last committed one.
        using (var journal = new FileStream(IndexFile.JournalPathFor(temp.Path), FileMode.Append, FileAccess.Write, FileShare.ReadWrite))
        {
            journal.Write(new byte[3000]);
        }

        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);

        Assert.Equal([1], reader.Database.GetCollection("photos").FindAll().Select(d => d["_id"].AsInt32));
    }

    [Fact]
    public void Open_refuses_a_file_shorter_than_the_pages_its_header_counts_naming_both_sizes()
    {
        using var temp = new TempIndex();
        CreateIndexWithData(temp.Path);
        long length = new FileInfo(temp.Path).Length;
        using (var stream = new FileStream(temp.Path, FileMode.Open, FileAccess.Write))
        {
            stream.SetLength(length - 8192);
        }

        var error = Assert.Throws<IndexFileException>(() => IndexFile.Open(temp.Path, IndexAccess.Read));

        Assert.Equal(IndexFileProblem.NotAnIndex, error.Problem);
        Assert.Contains($"is truncated: it is {length - 8192:N0} bytes long but its header counts {length / 8192:N0} pages", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_empty_index_file_left_by_a_killed_writer_is_adopted()
    {
        using var temp = new TempIndex();
        File.WriteAllBytes(temp.Path, []);

        using (var writer = IndexFile.Open(temp.Path, IndexAccess.Write))
        {
            Assert.Equal(IndexFile.CurrentSchemaVersion, writer.SchemaVersion);
        }

        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);
        Assert.Equal(IndexFile.CurrentSchemaVersion, reader.SchemaVersion);
    }

    [Fact]
    public void A_reader_cannot_write()
    {
        using var temp = new TempIndex();
        IndexFile.Open(temp.Path, IndexAccess.Write).Dispose();
        using var reader = IndexFile.Open(temp.Path, IndexAccess.Read);
        var error = Assert.Throws<InvalidOperationException>(() => reader.InTransaction(() => { }));
        Assert.Contains("opened for reading", error.Message);
    }

    private static void CreateIndexWithData(string path)
    {
        using var file = IndexFile.Open(path, IndexAccess.Write);
        file.InTransaction(() =>
        {
            var photos = file.Database.GetCollection("photos");
            for (int i = 0; i < 200; i++)
            {
                photos.Insert(new BsonDocument { ["_id"] = i, ["p"] = new byte[500] });
            }
        });
    }
}

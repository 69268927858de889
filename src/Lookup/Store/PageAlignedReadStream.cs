namespace Lookup.Store;

/// <summary>
/// A read-only view of an index file or journal that ends at the last whole LiteDB page. A write cut short by a full
/// disk or a crash can leave part of a page at the end; LiteDB then trims the file to whole pages when it opens it,
/// which a reader (read-only stream) cannot do. The partial page belongs to a transaction that never committed, so
/// hiding it changes nothing a reader should see.
/// </summary>
internal sealed class PageAlignedReadStream(Stream inner, int pageSize) : Stream
{
    public override bool CanRead => true;

    public override bool CanSeek => true;

    public override bool CanWrite => false;

    public override long Length => inner.Length - (inner.Length % pageSize);

    public override long Position
    {
        get => inner.Position;
        set => inner.Position = value;
    }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        long left = Length - inner.Position;
        return left <= 0 ? 0 : inner.Read(buffer[..(int)Math.Min(buffer.Length, left)]);
    }

    public override long Seek(long offset, SeekOrigin origin) =>
        origin == SeekOrigin.End ? inner.Seek(Length + offset, SeekOrigin.Begin) : inner.Seek(offset, origin);

    public override void Flush()
    {
    }

    public override void SetLength(long value) => throw new NotSupportedException("The index is open for reading.");

    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException("The index is open for reading.");

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            inner.Dispose();
        }

        base.Dispose(disposing);
    }
}

using System.Diagnostics;

namespace Lookup.Imaging;

/// <summary>
/// A read-only stream over bytes already in memory that throws <see cref="TimeoutException"/> once a deadline has
/// passed. ImageSharp 2.1 checks its cancellation token only in the JPEG and TIFF decoders; PNG and GIF read their
/// compressed data progressively, so checking the clock on each read interrupts them too (measured: a 12 MP PNG or
/// GIF stops within a few milliseconds of the deadline). WebP and BMP read everything up front and cannot be
/// interrupted; <see cref="PhotoDecoder"/> refuses them afterwards if they overran.
/// </summary>
internal sealed class DeadlineReadStream(ReadOnlyMemory<byte> content, long deadlineTimestamp) : Stream
{
    private long position;

    public override bool CanRead => true;

    public override bool CanSeek => true;

    public override bool CanWrite => false;

    public override long Length => content.Length;

    public override long Position
    {
        get => position;
        set => position = Math.Clamp(value, 0, content.Length);
    }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        if (Stopwatch.GetTimestamp() > deadlineTimestamp)
        {
            throw new TimeoutException("The decode deadline has passed.");
        }

        var available = (int)Math.Min(buffer.Length, content.Length - position);
        if (available <= 0)
        {
            return 0;
        }

        content.Span.Slice((int)position, available).CopyTo(buffer);
        position += available;
        return available;
    }

    public override int ReadByte()
    {
        Span<byte> one = stackalloc byte[1];
        return Read(one) == 1 ? one[0] : -1;
    }

    public override long Seek(long offset, SeekOrigin origin)
    {
        Position = origin switch
        {
            SeekOrigin.Begin => offset,
            SeekOrigin.Current => position + offset,
            _ => content.Length + offset,
        };
        return position;
    }

    public override void Flush()
    {
    }

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();
}

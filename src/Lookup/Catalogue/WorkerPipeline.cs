using System.Threading.Channels;

namespace Lookup.Catalogue;

/// <summary>
/// N identical workers feeding one writer through a bounded channel: each worker takes an item, does all of its
/// work (read, hash, decode, embed) and posts the result; the writer, on the calling thread, receives results in
/// batches and commits each batch before asking for the next.
/// </summary>
/// <remarks>
/// This shape was measured best on 2 cores: identical workers keep every core busy whatever the mix of photo
/// sizes, where a split decode-thread → inference-thread pipeline stalls whenever its stages differ in cost.
/// The bounded result channel keeps memory flat: workers wait when the writer falls behind.
/// On cancellation no new item is started; results already produced are still handed to the writer, so work
/// done is committed, then <see cref="OperationCanceledException"/> is thrown.
/// </remarks>
internal static class WorkerPipeline
{
    /// <summary>Runs <paramref name="work"/> over <paramref name="items"/> on <paramref name="workers"/> threads and
    /// hands results to <paramref name="commit"/> in batches of at most <paramref name="batchSize"/>.</summary>
    /// <param name="items">What to do, in order of dispatch.</param>
    /// <param name="workers">Number of worker threads, at least 1.</param>
    /// <param name="batchSize">Largest batch handed to <paramref name="commit"/>.</param>
    /// <param name="maxBatchDelay">A partial batch is committed once its first result has waited this long.</param>
    /// <param name="work">Turns one item into a result; must not throw for a bad input (return a failure result
    /// instead); an exception it throws stops the run after committing what is done and is rethrown.</param>
    /// <param name="commit">Called on the calling thread with each batch, in arrival order.</param>
    /// <param name="cancellationToken">Stops dispatching new items.</param>
    public static void Run<TItem, TResult>(
        IReadOnlyList<TItem> items,
        int workers,
        int batchSize,
        TimeSpan maxBatchDelay,
        Func<TItem, TResult> work,
        Action<IReadOnlyList<TResult>> commit,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(workers);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(batchSize);
        var results = Channel.CreateBounded<TResult>(new BoundedChannelOptions(Math.Max(batchSize * 2, workers * 4))
        {
            SingleReader = true,
            SingleWriter = false,
        });
        int next = -1;
        Exception? failure = null;
        var threads = new Thread[Math.Min(workers, Math.Max(items.Count, 1))];
        int running = threads.Length;
        for (int t = 0; t < threads.Length; t++)
        {
            threads[t] = new Thread(() =>
            {
                try
                {
                    int i;
                    while (!cancellationToken.IsCancellationRequested && Volatile.Read(ref failure) is null
                           && (i = Interlocked.Increment(ref next)) < items.Count)
                    {
                        TResult result = work(items[i]);
                        results.Writer.WriteAsync(result).AsTask().GetAwaiter().GetResult();
                    }
                }
                catch (Exception e)
                {
                    Interlocked.CompareExchange(ref failure, e, null);
                }
                finally
                {
                    if (Interlocked.Decrement(ref running) == 0)
                    {
                        results.Writer.Complete();
                    }
                }
            })
            {
                IsBackground = true,
                Name = $"lookup-worker-{t}",
            };
            threads[t].Start();
        }

        try
        {
            DrainInBatches(results.Reader, batchSize, maxBatchDelay, commit);
        }
        catch (Exception e)
        {
            // A commit that fails (disk full, I/O error) ends the run: workers stop after the item in hand, the results
            // still queued are dropped (never committed), and the commit's error is what the caller sees.
            Interlocked.CompareExchange(ref failure, e, null);
            while (results.Reader.WaitToReadAsync().AsTask().GetAwaiter().GetResult())
            {
                while (results.Reader.TryRead(out _))
                {
                }
            }

            foreach (var thread in threads)
            {
                thread.Join();
            }

            throw;
        }

        foreach (var thread in threads)
        {
            thread.Join();
        }

        if (failure is not null)
        {
            throw new AggregateException("a worker failed; the results before it were committed", failure);
        }

        cancellationToken.ThrowIfCancellationRequested();
    }

    private static void DrainInBatches<TResult>(
        ChannelReader<TResult> reader,
        int batchSize,
        TimeSpan maxBatchDelay,
        Action<IReadOnlyList<TResult>> commit)
    {
        var batch = new List<TResult>(batchSize);
        while (reader.WaitToReadAsync().AsTask().GetAwaiter().GetResult())
        {
            DateTime deadline = DateTime.UtcNow + maxBatchDelay;
            while (batch.Count < batchSize)
            {
                if (reader.TryRead(out TResult? result))
                {
                    batch.Add(result);
                    continue;
                }

                TimeSpan left = deadline - DateTime.UtcNow;
                if (left <= TimeSpan.Zero || !WaitFor(reader, left))
                {
                    break;
                }
            }

            commit(batch);
            batch = new List<TResult>(batchSize);
        }
    }

    private static bool WaitFor<TResult>(ChannelReader<TResult> reader, TimeSpan timeout)
    {
        using var timer = new CancellationTokenSource(timeout);
        try
        {
            return reader.WaitToReadAsync(timer.Token).AsTask().GetAwaiter().GetResult();
        }
        catch (OperationCanceledException)
        {
            return true;
        }
    }
}

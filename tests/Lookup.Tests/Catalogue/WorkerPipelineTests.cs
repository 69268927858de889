using Lookup.Catalogue;

namespace Lookup.Tests.Catalogue;

public sealed class WorkerPipelineTests
{
    [Theory]
    [InlineData(1, 1, 0)]
    [InlineData(1, 7, 1)]
    [InlineData(2, 3, 100)]
    [InlineData(4, 16, 1000)]
    public void Run_commits_every_result_exactly_once_in_batches_no_larger_than_asked(int workers, int batchSize, int count)
    {
        int[] items = Enumerable.Range(0, count).ToArray();
        var committed = new List<int>();
        int largest = 0;

        WorkerPipeline.Run(items, workers, batchSize, TimeSpan.FromMilliseconds(50), i => i * 10, batch =>
        {
            largest = Math.Max(largest, batch.Count);
            committed.AddRange(batch);
        }, CancellationToken.None);

        Assert.Equal(items.Select(i => i * 10).Order(), committed.Order());
        Assert.True(largest <= batchSize);
    }

    [Fact]
    public void Run_commits_finished_results_before_reporting_a_cancellation()
    {
        using var stop = new CancellationTokenSource();
        int[] items = Enumerable.Range(0, 1000).ToArray();
        var committed = new List<int>();
        int done = 0;

        Assert.Throws<OperationCanceledException>(() => WorkerPipeline.Run(items, 2, 8, TimeSpan.FromMilliseconds(10), i =>
        {
            if (Interlocked.Increment(ref done) == 50)
            {
                stop.Cancel();
            }

            return i;
        }, committed.AddRange, stop.Token));

        Assert.InRange(committed.Count, 50, 60);
        Assert.Equal(committed.Count, committed.Distinct().Count());
    }

    [Fact]
    public void Run_rethrows_a_worker_exception_after_committing_what_was_done()
    {
        int[] items = Enumerable.Range(0, 100).ToArray();
        var committed = new List<int>();

        var error = Assert.Throws<AggregateException>(() => WorkerPipeline.Run(items, 1, 4, TimeSpan.FromMilliseconds(10), i =>
            i == 20 ? throw new InvalidOperationException("boom") : i, committed.AddRange, CancellationToken.None));

        Assert.IsType<InvalidOperationException>(error.InnerException);
        Assert.Equal(Enumerable.Range(0, 20), committed);
    }
}

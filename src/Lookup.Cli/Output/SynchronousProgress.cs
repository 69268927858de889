namespace Lookup.Cli.Output;

/// <summary>An <see cref="IProgress{T}"/> that reports on the caller's thread (Progress&lt;T&gt; posts to the thread
/// pool, which reorders and delays lines).</summary>
internal sealed class SynchronousProgress<T>(Action<T> report) : IProgress<T>
{
    public void Report(T value) => report(value);
}

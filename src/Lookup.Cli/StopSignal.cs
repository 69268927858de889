using System.Runtime.InteropServices;

namespace Lookup.Cli;

/// <summary>
/// Turns the first Ctrl+C (SIGINT) or SIGTERM into a cancellation, so a long command can stop after committing what
/// it has done; a second signal gets the default handling and ends the process at once.
/// </summary>
/// <remarks>
/// System.CommandLine only listens for signals while an asynchronous action is pending, and its handler ends the
/// process two seconds after the first signal whether or not the command has finished committing. A command that
/// owns a writer wants neither, so it registers its own handlers for exactly the time it runs.
/// </remarks>
internal sealed class StopSignal : IDisposable
{
    private readonly CancellationTokenSource _source;
    private readonly PosixSignalRegistration _interrupt;
    private readonly PosixSignalRegistration _terminate;
    private int _signals;

    /// <summary>Starts listening; <see cref="Token"/> is also cancelled with <paramref name="outer"/>.</summary>
    public StopSignal(CancellationToken outer)
    {
        _source = CancellationTokenSource.CreateLinkedTokenSource(outer);
        _interrupt = PosixSignalRegistration.Create(PosixSignal.SIGINT, OnSignal);
        _terminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, OnSignal);
    }

    /// <summary>Cancelled by the first signal.</summary>
    public CancellationToken Token => _source.Token;

    /// <summary>Stops listening; later signals get the default handling again.</summary>
    public void Dispose()
    {
        _interrupt.Dispose();
        _terminate.Dispose();
        _source.Dispose();
    }

    private void OnSignal(PosixSignalContext context)
    {
        if (Interlocked.Increment(ref _signals) == 1)
        {
            context.Cancel = true;
            try
            {
                _source.Cancel();
            }
            catch (ObjectDisposedException)
            {
                // The command finished as the signal arrived: nothing left to stop.
            }
        }
    }
}

namespace Lookup.Cli;

/// <summary>
/// Process exit codes, the same for every command (documented in README and in --help).
/// </summary>
internal static class ExitCodes
{
    /// <summary>Everything asked was done.</summary>
    public const int Success = 0;

    /// <summary>The command ran but some inputs failed (photos recorded with reasons), or an error stopped it.</summary>
    public const int Failures = 1;

    /// <summary>The command line was wrong: unknown option, missing argument, bad value.</summary>
    public const int Usage = 2;

    /// <summary>A sweep found findings that were not in the previous sweep (of the kinds asked for).</summary>
    public const int NewFindings = 3;

    /// <summary>Stopped by Ctrl+C (SIGINT); work already committed is kept (128 + 2, common practice for shells).</summary>
    public const int Interrupted = 130;
}

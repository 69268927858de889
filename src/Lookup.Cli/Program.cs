using System.CommandLine;
using Lookup.Cli.Output;

namespace Lookup.Cli;

/// <summary>The command registry: each command lives in its own file and is added here.</summary>
internal static class Program
{
    /// <summary>Runs the command line; on a terminal, names cannot send control sequences (<see cref="TerminalSafeWriter"/>).</summary>
    private static int Main(string[] args) => Run(args, new InvocationConfiguration
    {
        Output = Console.IsOutputRedirected ? Console.Out : new TerminalSafeWriter(Console.Out),
        Error = Console.IsErrorRedirected ? Console.Error : new TerminalSafeWriter(Console.Error),
    });

    /// <summary>
    /// Parses and runs one command line; any parse error exits with <see cref="ExitCodes.Usage"/>. Commands report
    /// the failures they expect themselves; anything else that escapes (a damaged index LiteDB cannot read through,
    /// a failing disk) is reported here in one paragraph with what to do, never as a stack trace, and exits with
    /// <see cref="ExitCodes.Failures"/>.
    /// </summary>
    internal static int Run(string[] args, InvocationConfiguration configuration)
    {
        var parseResult = CreateRootCommand().Parse(args);
        configuration.EnableDefaultExceptionHandler = false;
        int exitCode;
        try
        {
            exitCode = parseResult.Invoke(configuration);
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            configuration.Error.WriteLine(Unexpected(parseResult.CommandResult.Command.Name, e));
            return ExitCodes.Failures;
        }

        return parseResult.Errors.Count > 0 ? ExitCodes.Usage : exitCode;
    }

    private static string Unexpected(string command, Exception e)
    {
        var inner = e is AggregateException { InnerExceptions.Count: 1 } single ? single.InnerException! : e;
        string cause = inner is IOException or UnauthorizedAccessException
            ? "A file could not be read or written: check free disk space, permissions and the storage, then run the same command again (committed work is kept)."
            : "If the index file is damaged (overwritten, or a copy cut short), 'lookup check --index FILE' says what is wrong and whether --repair can mend it; " +
              "otherwise restore it from a backup or ingest the catalogue into a new index file. If the check finds nothing, this is a fault in Lookup: please report it with the command line and this message.";
        return $"lookup {command}: stopped by an unexpected {inner.GetType().Name}: {inner.Message} {cause}";
    }

    internal static RootCommand CreateRootCommand()
    {
        var root = new RootCommand(
            """
            Lookup: identify parts from photos against a catalogue and keep the catalogue free of duplicates.

            Example:
              lookup demo                                     a tour on the invented demo catalogue (about a minute)
              lookup ingest /srv/photos --index parts.lookup  then match, sweep: see lookup COMMAND --help
            """);
        root.Subcommands.Add(InspectCommand.Create());
        root.Subcommands.Add(IngestCommand.Create());
        root.Subcommands.Add(CalibrateCommand.Create());
        root.Subcommands.Add(StatusCommand.Create());
        root.Subcommands.Add(CheckCommand.Create());
        root.Subcommands.Add(MergeCommand.Create());
        root.Subcommands.Add(SweepCommand.Create());
        root.Subcommands.Add(DismissCommand.Create());
        root.Subcommands.Add(MatchCommand.Create());
        root.Subcommands.Add(DemoCommand.Create());
        return root;
    }
}

using System.CommandLine;

namespace Lookup.Cli;

/// <summary>The command registry: each command lives in its own file and is added here.</summary>
internal static class Program
{
    private static int Main(string[] args) => Run(args, new InvocationConfiguration());

    /// <summary>Parses and runs one command line; any parse error exits with <see cref="ExitCodes.Usage"/>.</summary>
    internal static int Run(string[] args, InvocationConfiguration configuration)
    {
        var parseResult = CreateRootCommand().Parse(args);
        var exitCode = parseResult.Invoke(configuration);
        return parseResult.Errors.Count > 0 ? ExitCodes.Usage : exitCode;
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
        root.Subcommands.Add(MergeCommand.Create());
        root.Subcommands.Add(SweepCommand.Create());
        root.Subcommands.Add(DismissCommand.Create());
        root.Subcommands.Add(MatchCommand.Create());
        root.Subcommands.Add(DemoCommand.Create());
        return root;
    }
}

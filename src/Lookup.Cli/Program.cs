using System.CommandLine;

namespace Lookup.Cli;

internal static class Program
{
    private static int Main(string[] args)
    {
        var root = new RootCommand("Lookup: identify parts from photos against a catalogue and keep the catalogue free of duplicates.");
        return root.Parse(args).Invoke();
    }
}

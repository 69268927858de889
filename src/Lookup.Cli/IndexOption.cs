using System.CommandLine;

namespace Lookup.Cli;

/// <summary>The <c>--index</c> option every command that reads or writes an index takes.</summary>
internal static class IndexOption
{
    public static Option<string> Create() => new("--index")
    {
        Description = "The index file (one file holding photos, graph, sweeps and decisions).",
        Required = true,
    };
}

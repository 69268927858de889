using Lookup.Cli;

namespace Lookup.Tests.Cli;

/// <summary>Every command's --help shows at least one example command line of that command.</summary>
public sealed class HelpTests
{
    public static TheoryData<string> Commands()
    {
        var data = new TheoryData<string>();
        foreach (var command in Program.CreateRootCommand().Subcommands)
        {
            data.Add(command.Name);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Commands))]
    public void Help_of_each_command_shows_an_example_of_it(string command)
    {
        var (exitCode, output, _) = MatchIndexFixture.Run(command, "--help");

        Assert.Equal(0, exitCode);
        var example = output.IndexOf("Example:", StringComparison.Ordinal);
        Assert.True(example >= 0, $"lookup {command} --help has no example:\n{output}");
        Assert.Contains($"lookup {command}", output[example..], StringComparison.Ordinal);
    }

    [Fact]
    public void Help_of_the_program_starts_with_the_tour()
    {
        var (exitCode, output, _) = MatchIndexFixture.Run("--help");

        Assert.Equal(0, exitCode);
        Assert.Contains("lookup demo", output, StringComparison.Ordinal);
        Assert.Contains(Program.CreateRootCommand().Subcommands, c => c.Name == "demo");
    }
}

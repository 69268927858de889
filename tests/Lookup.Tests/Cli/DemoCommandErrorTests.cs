namespace Lookup.Tests.Cli;

/// <summary><c>lookup demo</c> refuses a folder that is not the demo catalogue before loading anything.</summary>
public sealed class DemoCommandErrorTests
{
    [Fact]
    public void A_catalogue_folder_without_the_truth_file_exits_1_naming_the_folder_and_the_fix()
    {
        var empty = Directory.CreateTempSubdirectory("lookup-demo-empty-").FullName;
        try
        {
            var (exitCode, output, error) = MatchIndexFixture.Run("demo", "--catalogue", empty);

            Assert.Equal(1, exitCode);
            Assert.Equal("", output);
            Assert.Contains(empty, error, StringComparison.Ordinal);
            Assert.Contains("truth.json", error, StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(empty, recursive: true);
        }
    }

    [Fact]
    public void Zero_workers_is_a_usage_error()
    {
        var (exitCode, _, error) = MatchIndexFixture.Run("demo", "--workers", "0");

        Assert.Equal(2, exitCode);
        Assert.Contains("--workers", error, StringComparison.Ordinal);
    }
}

using System.Diagnostics;

namespace Lookup.Tests.Slurm;

/// <summary>Runs a program to completion with a time limit, capturing its output.</summary>
internal static class ShellCommand
{
    public static (int ExitCode, string Output, string Error) Run(
        string program, IEnumerable<string> arguments, IReadOnlyDictionary<string, string>? environment = null, TimeSpan? limit = null)
    {
        var start = new ProcessStartInfo(program)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        foreach (string argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }

        foreach (var (name, value) in environment ?? new Dictionary<string, string>())
        {
            start.Environment[name] = value;
        }

        using var process = Process.Start(start) ?? throw new InvalidOperationException($"{program} did not start.");
        process.StandardInput.Close();
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(limit ?? TimeSpan.FromMinutes(2)))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"{program} {string.Join(' ', start.ArgumentList)} did not finish within {limit}: {error.Result}");
        }

        process.WaitForExit();
        return (process.ExitCode, output.Result, error.Result);
    }
}

using System.Diagnostics;
using System.Globalization;
using Lookup.Imaging;
using Lookup.Tests.Imaging;

namespace Lookup.Bench;

/// <summary>
/// <c>fuzz --cases N [--seed S] [--decode-seconds T]</c>: the test suite's byte-mutation fuzz run
/// (<see cref="PhotoFuzz"/>) at any size. Exit code 1 when anything but a rejection escaped or a case hung.
/// </summary>
internal static class FuzzBench
{
    public static int Run(string[] args)
    {
        var cases = Option(args, "--cases", 20_000);
        var seed = Option(args, "--seed", 1);
        var seconds = Option(args, "--decode-seconds", 5);
        var replay = Option(args, "--replay", -1);
        if (replay >= 0)
        {
            return Replay(seed, replay, seconds);
        }

        var clock = Stopwatch.StartNew();
        var report = PhotoFuzz.Run(cases, seed, PhotoLimits.Default with { DecodeTimeout = TimeSpan.FromSeconds(seconds) });
        Console.WriteLine(report);
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{clock.Elapsed.TotalSeconds:0.0} s, {report.Cases / clock.Elapsed.TotalSeconds:0} cases/s"));
        foreach (var problem in report.Problems)
        {
            Console.WriteLine(problem);
        }

        return report.Problems.Count == 0 ? 0 : 1;
    }

    /// <summary>Decodes one case again, timed, and writes its bytes beside the working folder for a closer look.</summary>
    private static int Replay(int seed, int index, int seconds)
    {
        var (name, bytes, edits) = PhotoFuzz.Case(seed, index);
        var file = Path.GetFullPath($"fuzz-{seed}-{index}-{name}");
        File.WriteAllBytes(file, bytes);
        var decoder = new PhotoDecoder(PhotoLimits.Default with { DecodeTimeout = TimeSpan.FromSeconds(seconds) });
        for (var run = 0; run < 3; run++)
        {
            var clock = Stopwatch.StartNew();
            string outcome;
            try
            {
                using var photo = decoder.Decode(bytes, file);
                outcome = $"decoded {photo.Image.Width} × {photo.Image.Height}";
            }
            catch (PhotoRejectedException e)
            {
                outcome = e.Message;
            }

            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{edits}: {clock.Elapsed.TotalMilliseconds:0.0} ms, {outcome}"));
        }

        return 0;
    }

    private static int Option(string[] args, string name, int fallback)
    {
        var at = Array.IndexOf(args, name);
        return at >= 0 && at + 1 < args.Length ? int.Parse(args[at + 1], CultureInfo.InvariantCulture) : fallback;
    }
}

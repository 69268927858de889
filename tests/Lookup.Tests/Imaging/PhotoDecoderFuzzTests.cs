using System.Globalization;
using Lookup.Imaging;
using Xunit.Abstractions;

namespace Lookup.Tests.Imaging;

/// <summary>
/// Byte-mutation fuzzing of the decoder (<see cref="PhotoFuzz"/>). 3,000 cases by default; set LOOKUP_FUZZ_CASES to
/// run more and LOOKUP_FUZZ_SEED to draw other cases (a failure names its case and seed, so it can be replayed).
/// </summary>
public sealed class PhotoDecoderFuzzTests(ITestOutputHelper log)
{
    private const int DefaultCases = 3_000;

    [Fact]
    public void Mutated_photos_are_decoded_or_rejected_never_thrown_out_and_never_hang()
    {
        var cases = Setting("LOOKUP_FUZZ_CASES", DefaultCases);
        var seed = Setting("LOOKUP_FUZZ_SEED", 1);
        var limits = PhotoLimits.Default with { DecodeTimeout = TimeSpan.FromSeconds(5) };

        var report = PhotoFuzz.Run(cases, seed, limits);
        log.WriteLine(report.ToString());

        Assert.True(report.Problems.Count == 0, $"{report}\n{string.Join("\n", report.Problems.Take(5))}");
        Assert.Equal(cases, report.Cases);

        // The mutations must reach both outcomes, or the run tested nothing.
        Assert.True(report.Decoded > 0 && report.Rejected.GetValueOrDefault("Corrupt") > 0, report.ToString());
    }

    private static int Setting(string name, int fallback) =>
        int.TryParse(Environment.GetEnvironmentVariable(name), NumberStyles.Integer, CultureInfo.InvariantCulture, out var value) && value > 0
            ? value
            : fallback;
}

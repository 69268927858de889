namespace Lookup.Tests.Imaging;

/// <summary>What a <see cref="PhotoFuzz"/> run found.</summary>
internal sealed class FuzzReport
{
    /// <summary>Cases run.</summary>
    public int Cases { get; set; }

    /// <summary>Mutated files that still decoded to pixels.</summary>
    public int Decoded { get; set; }

    /// <summary>Refusals per reason.</summary>
    public SortedDictionary<string, int> Rejected { get; } = new(StringComparer.Ordinal);

    /// <summary>Cases where anything but a rejection escaped, or no answer came within the watchdog time.</summary>
    public List<string> Problems { get; } = [];

    /// <summary>The slowest case, in milliseconds.</summary>
    public double SlowestMilliseconds { get; set; }

    /// <summary>Which case was slowest.</summary>
    public string Slowest { get; set; } = "";

    public override string ToString() =>
        $"{Cases:N0} cases: {Decoded:N0} decoded, {string.Join(", ", Rejected.Select(r => $"{r.Value:N0} {r.Key}"))}; "
        + $"{Problems.Count} problems; slowest {SlowestMilliseconds:0.0} ms ({Slowest})";
}

using Lookup.Matching;

namespace Lookup.Demo;

/// <summary>What one demo tour works on.</summary>
internal sealed record DemoTourOptions
{
    /// <summary>The demo folder (holds <c>truth.json</c>, <c>photos/</c> and <c>field/</c>).</summary>
    public required string DemoFolder { get; init; }

    /// <summary>The index file to build or bring up to date.</summary>
    public required string IndexPath { get; init; }

    /// <summary>Query crops for the field photos: the same default as <c>lookup match</c>.</summary>
    public required CropSet Crops { get; init; }

    /// <summary>SKUs ranked per field photo.</summary>
    public int Top { get; init; } = 5;

    /// <summary>Threads for ingest, matching and the sweep.</summary>
    public int Workers { get; init; } = Environment.ProcessorCount;
}

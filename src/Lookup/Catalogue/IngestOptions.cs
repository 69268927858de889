using Lookup.Graph;
using Lookup.Imaging;

namespace Lookup.Catalogue;

/// <summary>Choices for one ingest run; defaults are what a nightly job wants.</summary>
internal sealed record IngestOptions
{
    /// <summary>The photo tree to index.</summary>
    public required string Root { get; init; }

    /// <summary>SKU mapping spec: <c>folder</c>, <c>csv:FILE</c> or <c>pattern:REGEX</c>.</summary>
    public string SkuMapping { get; init; } = "folder";

    /// <summary>Worker threads, each reading, hashing, decoding and embedding whole photos (default: one per core).</summary>
    public int Workers { get; init; } = Environment.ProcessorCount;

    /// <summary>Photos per index transaction.</summary>
    public int BatchSize { get; init; } = 64;

    /// <summary>Keep photos whose files are gone from the tree instead of retiring them.</summary>
    public bool KeepMissing { get; init; }

    /// <summary>Try again photos that failed before even when their files did not change.</summary>
    public bool RetryFailed { get; init; }

    /// <summary>Pixel, size, frame and time limits for decoding.</summary>
    public PhotoLimits Limits { get; init; } = PhotoLimits.Default;

    /// <summary>Graph settings for a new index (an existing index keeps its own).</summary>
    public HnswParameters Graph { get; init; } = new();

    /// <summary>Process only the photos of this shard (see <see cref="ShardSpec"/>); null for all.</summary>
    public ShardSpec? Shard { get; init; }
}

using Lookup.Catalogue;
using Lookup.Embedding;
using Lookup.Store;

namespace Lookup.Tests.Catalogue;

/// <summary>Runs the ingest engine over an <see cref="IngestTree"/> the way the command does: one writer handle per run.</summary>
internal static class EngineIngest
{
    /// <summary>Two workers and batches of four: several batches even for a handful of photos.</summary>
    public static IngestOptions Options(IngestTree tree) => new() { Root = tree.Root, Workers = 2, BatchSize = 4 };

    public static IngestSummary Run(
        IngestTree tree,
        ImageEmbedder embedder,
        IngestOptions? options = null,
        ScanIo? scanIo = null,
        Func<string, byte[]>? readFile = null,
        IProgress<IngestProgress>? progress = null,
        CancellationToken cancellationToken = default)
    {
        using var file = IndexFile.Open(tree.IndexPath, IndexAccess.Write);
        var ingest = new CatalogueIngest(file, embedder)
        {
            ScanIo = scanIo ?? ScanIo.Default,
            ReadFile = readFile ?? File.ReadAllBytes,
        };
        return ingest.Run(options ?? Options(tree), progress, cancellationToken);
    }
}

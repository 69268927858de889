using Lookup.Embedding;
using Lookup.Graph;
using Lookup.Store;

namespace Lookup.Catalogue;

/// <summary>
/// What every part of a merge and its target must share: the catalogue root (the same tree on a shared
/// filesystem), the SKU mapping, the embedding model (fingerprint) and the graph's dimension and HNSW parameters.
/// Vectors from two models are not comparable, and records from two roots or mappings would mix two catalogues.
/// </summary>
internal sealed record MergeBasis(string Source, CatalogueSettings Settings, int Dimension, HnswParameters Parameters)
{
    /// <summary>Reads the basis of an ingested index (part or target).</summary>
    /// <exception cref="MergeRefusedException">The file holds no catalogue settings or no graph.</exception>
    public static MergeBasis Read(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        var settings = CatalogueSettings.Read(file);
        var store = new GraphStore(file);
        if (settings is null || !store.HasGraph)
        {
            throw new MergeRefusedException(file.Path, MergeProblem.NotIngested,
                $"{file.Path} holds {(settings is null ? "no catalogue settings" : "no graph")}: no ingest or merge has finished writing to it. " +
                "If it is a part, rerun that shard's ingest until it finishes, or leave the file out of the merge; if it is the target, merge into a new file.");
        }

        var graph = store.OpenLazy();
        return new MergeBasis(file.Path, settings, graph.Dimension, graph.Parameters);
    }

    /// <summary>Throws unless <paramref name="part"/> was built the same way as this basis.</summary>
    /// <exception cref="MergeRefusedException">Model, root, SKU mapping or graph differ; the message names both files.</exception>
    public void RequireSame(MergeBasis part)
    {
        ArgumentNullException.ThrowIfNull(part);
        var mine = Settings;
        var theirs = part.Settings;
        if (mine.ModelFingerprint != theirs.ModelFingerprint)
        {
            throw Refuse(part, MergeProblem.ModelMismatch,
                $"{part.Source} was built with model '{ModelName(theirs)}' (fingerprint {Short(theirs.ModelFingerprint)}), " +
                $"{Source} with '{ModelName(mine)}' (fingerprint {Short(mine.ModelFingerprint)}): vectors of two models cannot share a graph. " +
                $"Re-ingest that shard with the same --model, or merge it into a separate index.");
        }

        if (!string.Equals(mine.CatalogueRoot, theirs.CatalogueRoot, StringComparison.Ordinal))
        {
            throw Refuse(part, MergeProblem.RootMismatch,
                $"{part.Source} indexes the catalogue at {theirs.CatalogueRoot}, {Source} the one at {mine.CatalogueRoot}: " +
                "parts must come from one tree, seen under the same path by every job (a shared filesystem). " +
                "Re-ingest that shard with the same tree path, or merge it into a separate index.");
        }

        if (!string.Equals(mine.SkuMapping, theirs.SkuMapping, StringComparison.Ordinal))
        {
            throw Refuse(part, MergeProblem.SkuMappingMismatch,
                $"{part.Source} maps SKUs by '{theirs.SkuMapping}', {Source} by '{mine.SkuMapping}': " +
                "re-ingest that shard with the same --sku-from, or merge it into a separate index.");
        }

        if (Dimension != part.Dimension || Parameters != part.Parameters)
        {
            throw Refuse(part, MergeProblem.GraphMismatch,
                $"{part.Source} has a graph of {part.Dimension} floats with {Describe(part.Parameters)}, " +
                $"{Source} one of {Dimension} floats with {Describe(Parameters)}: " +
                "build every part with the same graph settings, or merge it into a separate index.");
        }
    }

    private static MergeRefusedException Refuse(MergeBasis part, MergeProblem problem, string message) => new(part.Source, problem, message);

    private static string Describe(HnswParameters p) =>
        $"M {p.M}, efConstruction {p.EfConstruction}, efSearch {p.EfSearch}, seed {p.Seed}, keep-pruned {p.KeepPrunedConnections}, exact below {p.ExactBelow}";

    private static string Short(string fingerprint) => fingerprint.Length > 12 ? fingerprint[..12] + "…" : fingerprint;

    private static string ModelName(CatalogueSettings settings)
    {
        try
        {
            return ModelCard.FromJson(settings.ModelCardJson, Environment.CurrentDirectory).Name;
        }
        catch (ModelLoadException)
        {
            return "unknown";
        }
    }
}

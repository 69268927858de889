using LiteDB;

namespace Lookup.Store;

/// <summary>
/// How an index was built: the catalogue root, the SKU mapping, and the model card with its fingerprint.
/// Later runs compare against it (another model is refused; another root or mapping is said plainly).
/// </summary>
/// <param name="CatalogueRoot">Absolute path of the photo tree last ingested.</param>
/// <param name="SkuMapping">The mapping spec (folder, csv:FILE, pattern:REGEX).</param>
/// <param name="ModelCardJson">The model card as JSON, so queries embed exactly as ingest did.</param>
/// <param name="ModelFingerprint">SHA-256 of the model files and preprocessing.</param>
/// <param name="UpdatedUtc">When the settings were last written.</param>
public sealed record CatalogueSettings(
    string CatalogueRoot,
    string SkuMapping,
    string ModelCardJson,
    string ModelFingerprint,
    DateTime UpdatedUtc)
{
    private const string CollectionName = "catalogue_meta";
    private const string Id = "settings";

    /// <summary>The settings stored in <paramref name="file"/>, or null for an index never ingested into.</summary>
    public static CatalogueSettings? Read(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        if (!file.Database.CollectionExists(CollectionName))
        {
            return null;
        }

        var doc = file.Database.GetCollection(CollectionName).FindById(Id);
        return doc is null
            ? null
            : new CatalogueSettings(
                doc["root"].AsString,
                doc["sku"].AsString,
                doc["card"].AsString,
                doc["fp"].AsString,
                doc["updated"].AsDateTime.ToUniversalTime());
    }

    /// <summary>Writes these settings into <paramref name="file"/> (joins the caller's transaction).</summary>
    public void Write(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        file.RequireWritable();
        file.Database.GetCollection(CollectionName).Upsert(new BsonDocument
        {
            ["_id"] = Id,
            ["root"] = CatalogueRoot,
            ["sku"] = SkuMapping,
            ["card"] = ModelCardJson,
            ["fp"] = ModelFingerprint,
            ["updated"] = UpdatedUtc,
        });
    }
}
